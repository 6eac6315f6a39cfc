// Errors in Meilisearch's wire shape: { message, code, type, link }, with the
// HTTP status Meilisearch gives each code.
export type ErrorType = "invalid_request" | "auth" | "internal" | "system";

export interface MeiliErrorBody {
  message: string;
  code: string;
  type: ErrorType;
  link: string;
}

export class MeiliError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly type: ErrorType = "invalid_request",
  ) {
    super(message);
  }

  toJSON(): MeiliErrorBody {
    return { message: this.message, code: this.code, type: this.type, link: `https://docs.meilisearch.com/errors#${this.code}` };
  }
}

export const errors = {
  missingAuthorization: () =>
    new MeiliError(401, "missing_authorization_header", "The Authorization header is missing. It must use the bearer authorization method.", "auth"),
  invalidApiKey: () => new MeiliError(403, "invalid_api_key", "The provided API key is invalid.", "auth"),
  indexNotFound: (uid: string) => new MeiliError(404, "index_not_found", `Index \`${uid}\` not found.`),
  indexAlreadyExists: (uid: string) => new MeiliError(409, "index_already_exists", `Index \`${uid}\` already exists.`),
  invalidIndexUid: (uid: string) =>
    new MeiliError(
      400,
      "invalid_index_uid",
      `\`${uid}\` is not a valid index uid. Index uid can be an integer or a string containing only alphanumeric characters, hyphens (-) and underscores (_), and can not be more than 512 bytes.`,
    ),
  documentNotFound: (id: string) => new MeiliError(404, "document_not_found", `Document \`${id}\` not found.`),
  taskNotFound: (uid: string) => new MeiliError(404, "task_not_found", `Task \`${uid}\` not found.`),
  notFound: () => new MeiliError(404, "not_found", "Not found."),
  badRequest: (message: string, code = "bad_request") => new MeiliError(400, code, message),
  invalidFilter: (message: string, code = "invalid_search_filter") => new MeiliError(400, code, message),
  payloadTooLarge: () => new MeiliError(413, "payload_too_large", "The provided payload reached the size limit."),
  internal: (message: string) => new MeiliError(500, "internal", message, "internal"),
};

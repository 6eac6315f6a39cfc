import { ApiTokenSchema } from "./api-token.entity";
import { AttachmentSchema } from "./attachment.entity";
import { BlockVersionSchema } from "./block-version.entity";
import { BlockSchema } from "./block.entity";
import { CheckRunSchema } from "./check-run.entity";
import { EndedSessionSchema } from "./ended-session.entity";
import { InvitationSchema } from "./invitation.entity";
import { MembershipSchema } from "./membership.entity";
import { ModelVersionSchema } from "./model-version.entity";
import { ModelSchema } from "./model.entity";
import { OutboxEventSchema } from "./outbox-event.entity";
import { ReviewSchema } from "./review.entity";
import { SignInLinkSchema } from "./sign-in-link.entity";
import { SimResultSchema } from "./sim-result.entity";
import { TeamSchema } from "./team.entity";
import { UserSchema } from "./user.entity";
import { WatchSchema } from "./watch.entity";
import { WorkerHeartbeatSchema } from "./worker-heartbeat.entity";

export * from "./api-token.entity";
export * from "./attachment.entity";
export * from "./block-version.entity";
export * from "./block.entity";
export * from "./check-run.entity";
export * from "./ended-session.entity";
export * from "./invitation.entity";
export * from "./membership.entity";
export * from "./model-version.entity";
export * from "./model.entity";
export * from "./outbox-event.entity";
export * from "./review.entity";
export * from "./sign-in-link.entity";
export * from "./sim-result.entity";
export * from "./team.entity";
export * from "./user.entity";
export * from "./watch.entity";
export * from "./worker-heartbeat.entity";

// Listed by name: bundlers cannot scan folders.
export const allEntities = [
  UserSchema,
  TeamSchema,
  MembershipSchema,
  InvitationSchema,
  SignInLinkSchema,
  BlockSchema,
  BlockVersionSchema,
  CheckRunSchema,
  ReviewSchema,
  AttachmentSchema,
  WatchSchema,
  ApiTokenSchema,
  OutboxEventSchema,
  WorkerHeartbeatSchema,
  EndedSessionSchema,
  SimResultSchema,
  ModelSchema,
  ModelVersionSchema,
];

import { afterAll, describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import ApiDocsPage from "@/app/(library)/api-docs/page";
import type { Role } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { contextFor } from "@/lib/context";
import { closeOrm, getEm } from "@/lib/db/orm";
import { openApiDocument } from "@/lib/openapi/document";
import { createOwnToken, revokeTokenAs } from "@/lib/tokens/manage";
import { rolesThatMay, tokenRules } from "@/lib/tokens/rules";
import { makeTeam } from "./auth-fixtures";

afterAll(closeOrm);

// What the API reference and the settings page say about tokens, against what the token services let each role do.
const ROLES: Role[] = ["viewer", "author", "maintainer", "admin"];
const ctxOf = async (id: number) => contextFor(await loadCaller(await getEm(), id));
const newToken = async (id: number, teamSlug: string) =>
  createOwnToken(await ctxOf(id), { teamSlug, name: "rules", scope: "write", expiresInDays: 0 });

describe("who may make and revoke API tokens", () => {
  it("lets exactly the roles the reference names make a token of their own, and nobody outside the team", async () => {
    const { slug, people } = await makeTeam(ROLES);
    const made: Role[] = [];
    for (const p of people) if (await newToken(p.id, slug).then(() => true, () => false)) made.push(p.role);
    expect(made).toEqual(rolesThatMay("token.create"));
    const outsider = (await makeTeam(["admin"])).people[0];
    await expect(newToken(outsider.id, slug)).rejects.toMatchObject({ code: "not_found" });
  });

  it("lets exactly the roles the reference names revoke a colleague's token", async () => {
    const { slug, people } = await makeTeam([...ROLES, "viewer"]);
    const owner = people[4];
    const revoked: Role[] = [];
    for (const p of people.slice(0, 4)) {
      const { id } = await newToken(owner.id, slug);
      if (await revokeTokenAs(await ctxOf(p.id), { id }).then(() => true, () => false)) revoked.push(p.role);
    }
    expect(revoked).toEqual(rolesThatMay("token.manage"));
  });

  it("states today's rule in plain words on the API reference and in the OpenAPI document", () => {
    // DESIGN.md, Roles: a viewer fetches through the API (so holds tokens); an admin manages the team's tokens.
    const rules = tokenRules();
    expect(rules.create).toBe("Every member of a team, whatever their role, makes API tokens of their own for that team.");
    expect(rules.manage).toBe("A team's admins also see and revoke every token of their team.");
    const html = renderToStaticMarkup(ApiDocsPage());
    const paragraph = /<p[^>]*data-testid="token-rules"[^>]*>([\s\S]*?)<\/p>/.exec(html)?.[1].replace(/<[^>]+>/g, "").replace(/&#x27;/g, "'");
    expect(paragraph).toContain(rules.create);
    expect(paragraph).toContain(rules.reach);
    expect(paragraph).toContain(rules.manage);
    expect(html).not.toMatch(/an admin makes tokens/i);
    const scheme = openApiDocument().components?.securitySchemes?.bearerToken as { description: string };
    expect(scheme.description).toContain(rules.create);
  });
});

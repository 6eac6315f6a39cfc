import { randomUUID } from "node:crypto";
import { encode } from "next-auth/jwt";
import { MembershipSchema, TeamSchema, UserSchema, type Role } from "@/entities";
import { sessionCookieName } from "@/lib/auth/config";
import { hashPassword } from "@/lib/auth/passwords";
import { getEm } from "@/lib/db/orm";
import { readSink } from "@/lib/mail/mailbox";
import type { StoredMail } from "@/lib/mail/sink";

// Shared by the auth-, tokens- and mail- integration tests: a team of their own with people in given roles.
export const PASSWORD = "correct horse battery";

export async function makeTeam(roles: Role[]): Promise<{ tag: string; teamId: number; slug: string; people: { id: number; email: string; role: Role }[] }> {
  const em = await getEm();
  const tag = randomUUID().slice(0, 8);
  const team = em.create(TeamSchema, { slug: `t-${tag}`, name: `Team ${tag}`, createdAt: new Date() });
  const hash = await hashPassword(PASSWORD);
  const people = roles.map((role, i) => {
    const user = em.create(UserSchema, { email: `p${i}-${tag}@fenwick.test`, name: `Person ${i} ${tag}`, passwordHash: hash, createdAt: new Date() });
    em.create(MembershipSchema, { user, team, role, createdAt: new Date() });
    return { user, role };
  });
  await em.flush();
  return { tag, teamId: team.id, slug: team.slug, people: people.map((p) => ({ id: p.user.id, email: p.user.email, role: p.role })) };
}

/** Messages in the test run's sink addressed to one person, newest first. */
export function mailsTo(address: string): StoredMail[] {
  return readSink(process.env.ASSAY_MAIL_SINK_DIR!, 10_000).filter((m) => m.envelope.to.includes(address.toLowerCase()));
}

/** The first link to the app in a mail's plain-text part. */
export function linkIn(mail: StoredMail): URL {
  const m = /https?:\/\/\S+/.exec(mail.text);
  if (!m) throw new Error(`no link in mail "${mail.subject}"`);
  return new URL(m[0]);
}

/** A session cookie exactly as next-auth's JWT callback would issue it for this user id. */
export async function sessionCookie(userId: string): Promise<string> {
  const jwt = await encode({ token: { sub: userId }, secret: process.env.NEXTAUTH_SECRET! });
  return `${sessionCookieName()}=${jwt}`;
}

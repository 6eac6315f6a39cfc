import type { EntityManager } from "@mikro-orm/postgresql";
import { MembershipSchema, UserSchema } from "@/entities";
import { takeEvents, type PendingEvent } from "@/lib/outbox/outbox";
import { sendMail } from "./mailer";
import { newVersionMessage, nowFailingMessage, reviewRequestedMessage, versionApprovedMessage, type BlockRef, type Message } from "./messages";

// The outbox's mail consumer: a new version → watchers; review requested → the team's reviewers; version approved →
// its author and watchers; a head whose checks turn failing or error → watchers. Other events are marked and skipped.
type Payload = Record<string, unknown>;
const s = (v: unknown): string => (typeof v === "string" ? v : "");
const list = (v: unknown): string[] => (Array.isArray(v) ? v.filter((x): x is string => typeof x === "string") : []);
const BAD = new Set(["failing", "error"]);

interface Outgoing {
  to: string[];
  message: Message;
}

function ref(p: Payload): BlockRef | null {
  const slug = s(p.slug);
  const version = Number(p.version);
  return slug && Number.isInteger(version) ? { slug, version, title: s(p.title) || slug } : null;
}

/** Only people who can still read the block hear about it: for a team block, current members of the team. */
async function readers(em: EntityManager, p: Payload, addresses: string[]): Promise<string[]> {
  const unique = [...new Set(addresses.map((a) => a.toLowerCase()))];
  if (unique.length === 0 || p.visibility === "public") return unique;
  const rows = await em.find(MembershipSchema, { team: { slug: s(p.team) }, user: { email: { $in: unique } } }, { populate: ["user"] });
  const ok = new Set(rows.map((m) => m.user.email));
  return unique.filter((a) => ok.has(a));
}

async function nameOf(em: EntityManager, email: string): Promise<string> {
  return email ? ((await em.findOne(UserSchema, { email }))?.name ?? email) : "Someone";
}

/** The mail one event causes, or null. Exported for the tests' sake. */
export async function mailFor(em: EntityManager, e: Pick<PendingEvent, "kind" | "payload">): Promise<Outgoing | null> {
  const p = e.payload;
  const b = ref(p);
  if (!b || p.archived === true) return null;
  if (e.kind === "version.created") {
    const author = s(p.authorEmail).toLowerCase();
    const to = (await readers(em, p, list(p.watchers))).filter((a) => a !== author);
    return { to, message: newVersionMessage(b, s(p.authorName) || (await nameOf(em, author)), s(p.message)) };
  }
  if (e.kind === "review.requested") {
    const requester = s(p.requestedBy).toLowerCase();
    const to = (await readers(em, p, list(p.reviewers))).filter((a) => a !== requester);
    return { to, message: reviewRequestedMessage(b, await nameOf(em, requester)) };
  }
  if (e.kind === "review.decided" && p.decision === "approved") {
    const reviewer = s(p.reviewer).toLowerCase();
    const to = (await readers(em, p, [s(p.authorEmail), ...list(p.watchers)])).filter((a) => a !== reviewer);
    return { to, message: versionApprovedMessage(b, s(p.reviewerName) || (await nameOf(em, reviewer)), s(p.comment)) };
  }
  if (e.kind === "run.finished" && p.isHead !== false) {
    const badge = s(p.badge);
    // Only a change of state: a block that was already failing does not mail again on every rerun.
    if (!BAD.has(badge) || s(p.previousBadge) === badge) return null;
    return { to: await readers(em, p, list(p.watchers)), message: nowFailingMessage(b, badge) };
  }
  return null;
}

/**
 * Mails what up to `limit` unprocessed events call for and marks them notified. If a mail cannot be sent
 * the whole batch stays pending and is retried (a recipient may then get a mail twice, never none).
 */
export async function processNotifications(em: EntityManager, limit = 20): Promise<number> {
  return takeEvents(
    em,
    "notifiedAt",
    async (events) => {
      for (const e of events) {
        const out = await mailFor(em, e);
        // One mail per recipient, so nobody sees who else watches a block.
        for (const to of out?.to ?? []) await sendMail({ to, ...out!.message });
      }
    },
    limit,
  );
}

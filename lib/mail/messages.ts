import { appUrl } from "@/lib/auth/config";

// Every mail has a plain-text and an HTML part with the same words. Links carry nothing but a one-time token.
export interface Message {
  subject: string;
  text: string;
  html: string;
}

const esc = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

export const link = (pathAndQuery: string): string => `${appUrl()}${pathAndQuery}`;

function compose(subject: string, paragraphs: string[], action?: { label: string; url: string }, footer?: string): Message {
  const text = [...paragraphs, ...(action ? [`${action.label}: ${action.url}`] : []), ...(footer ? [footer] : []), "— Assay"].join("\n\n");
  const html = [
    `<div style="font-family:system-ui,sans-serif;color:#2b2b2a;max-width:560px;line-height:1.5">`,
    ...paragraphs.map((p) => `<p>${esc(p)}</p>`),
    action
      ? `<p><a href="${esc(action.url)}" style="color:#b0623a;font-weight:600">${esc(action.label)}</a></p><p style="font-size:12px;color:#4a4845">${esc(action.url)}</p>`
      : "",
    footer ? `<p style="font-size:12px;color:#4a4845">${esc(footer)}</p>` : "",
    `<p style="color:#4a4845">— Assay</p></div>`,
  ].join("\n");
  return { subject, text, html };
}

const blockUrl = (slug: string, version?: number) =>
  link(`/blocks/${encodeURIComponent(slug)}${version ? `/versions/${version}` : ""}`);

export function signInLinkMessage(token: string, minutes: number): Message {
  return compose(
    "Your Assay sign-in link",
    ["Someone (hopefully you) asked to sign in to Assay with this address."],
    { label: "Sign in to Assay", url: link(`/sign-in/link?token=${encodeURIComponent(token)}`) },
    `The link works once and expires in ${minutes} minutes. If you did not ask for it, ignore this mail.`,
  );
}

export function invitationMessage(p: { token: string; teamName: string; role: string; invitedBy: string; days: number }): Message {
  return compose(
    `You are invited to ${p.teamName} on Assay`,
    [`${p.invitedBy} invited you to join ${p.teamName} on Assay as ${p.role}.`],
    { label: "Accept the invitation", url: link(`/invitation?token=${encodeURIComponent(p.token)}`) },
    `The link works once and expires in ${p.days} days.`,
  );
}

export interface BlockRef {
  slug: string;
  version: number;
  title: string;
}

export function reviewRequestedMessage(b: BlockRef, requestedBy: string): Message {
  return compose(
    `Review requested: ${b.title} v${b.version}`,
    [`${requestedBy} asked for a review of version ${b.version} of “${b.title}” (${b.slug}).`],
    { label: "Open the block", url: blockUrl(b.slug, b.version) },
    "You receive this because you may approve versions in this block's team.",
  );
}

export function newVersionMessage(b: BlockRef, author: string, message: string): Message {
  return compose(
    `New version: ${b.title} v${b.version}`,
    [`${author} stored version ${b.version} of “${b.title}” (${b.slug}).`, ...(message ? [`Message: ${message}`] : []), "Its checks are running now."],
    { label: "Open the version", url: blockUrl(b.slug, b.version) },
    "You receive this because you watch this block. Unwatch it on its page to stop these mails.",
  );
}

export function versionApprovedMessage(b: BlockRef, reviewer: string, comment = ""): Message {
  return compose(
    `Approved: ${b.title} v${b.version}`,
    [`${reviewer} approved version ${b.version} of “${b.title}” (${b.slug}).`, ...(comment ? [`${reviewer}’s comment: ${comment}`] : [])],
    { label: "Open the block", url: blockUrl(b.slug, b.version) },
    "You receive this because you wrote this version or watch this block.",
  );
}

export function nowFailingMessage(b: BlockRef, badge: string): Message {
  return compose(
    `Now ${badge}: ${b.title} v${b.version}`,
    [`The checks of version ${b.version} of “${b.title}” (${b.slug}) are now ${badge}.`],
    { label: "See the checks", url: blockUrl(b.slug, b.version) },
    "You receive this because you watch this block. Unwatch it on its page to stop these mails.",
  );
}

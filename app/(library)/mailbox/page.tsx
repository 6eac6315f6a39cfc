import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { when } from "@/components/eng";
import { EmptyState } from "@/components/empty-state";
import { requireUser } from "@/lib/auth/session";
import { readSink, sinkDir } from "@/lib/mail/mailbox";
import { isMailboxViewer, visibleMail } from "@/lib/mail/mailbox-access";
import { pageContext } from "@/lib/next-context";

export const metadata: Metadata = { title: "Mailbox" };
export const dynamic = "force-dynamic";

// Only while npm start runs the local mail sink (no SMTP_URL given), and only for team admins.
export default async function MailboxPage() {
  const dir = sinkDir();
  if (!dir) notFound();
  const caller = await requireUser("/mailbox");
  if (!isMailboxViewer(caller)) notFound();
  const mails = await visibleMail(await pageContext(), readSink(dir, 300));
  return (
    <div className="max-w-4xl space-y-4">
      <h1 className="font-serif text-2xl font-semibold">Mailbox</h1>
      <p className="max-w-prose text-sm text-graphite">
        No mail server is configured, so Assay keeps its outgoing mail here. You see mail to yourself, to people whose
        teams you all administer, and to addresses invited to your teams. Set <code className="font-mono">SMTP_URL</code> to send real mail.
      </p>
      {mails.length === 0 ? (
        <EmptyState title="No mail for you to see yet." />
      ) : (
        <ul className="space-y-3">
          {mails.map((m) => (
            <li key={m.id}>
              <details className="rounded border border-rule bg-panel">
                <summary className="flex cursor-pointer flex-wrap gap-x-4 px-4 py-2 text-sm">
                  <span className="font-medium">{m.subject || "(no subject)"}</span>
                  <span className="font-mono text-graphite">to {m.envelope.to.join(", ")}</span>
                  <span className="ml-auto text-graphite">{when(m.receivedAt)}</span>
                </summary>
                {/* The plain-text part: links stay visible and clickable without rendering sent HTML. */}
                <pre className="overflow-x-auto whitespace-pre-wrap border-t border-rule px-4 py-3 font-mono text-xs leading-relaxed">
                  {linkify(m.text)}
                </pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? <a key={i} href={part} className="text-copper-dark underline">{part}</a> : part,
  );
}

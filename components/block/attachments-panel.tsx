import type { AttachmentInfo } from "@/lib/attachments/attachments";
import { attachmentUrl } from "@/lib/notes/render";
import { formatBytes } from "./format-bytes";
import { AttachmentUpload } from "./attachment-upload";
import { Panel } from "./panel";

/** Schematic images the note can show, with the line that shows each; authors and up may add one. */
export function AttachmentsPanel({ slug, attachments, canAttach }: { slug: string; attachments: AttachmentInfo[]; canAttach: boolean }) {
  if (attachments.length === 0 && !canAttach) return null;
  return (
    <Panel title="Attachments">
      {attachments.length ? (
        <ul className="space-y-2 text-sm" data-testid="attachment-list">
          {attachments.map((a) => (
            <li key={a.name} className="space-y-0.5">
              <a href={attachmentUrl(slug, a.name)} className="font-mono text-copper-dark underline">{a.name}</a>
              <span className="ml-2 text-xs text-graphite">{a.contentType === "image/png" ? "PNG" : "SVG"}, {formatBytes(a.size)}</span>
              <p className="text-xs text-graphite">In the note: <code className="select-all font-mono text-ink">![schematic]({a.name})</code></p>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-graphite">No images yet. Attach a schematic and show it in the note.</p>
      )}
      {canAttach ? <AttachmentUpload slug={slug} /> : null}
    </Panel>
  );
}

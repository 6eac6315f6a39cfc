import { renderNote } from "@/lib/notes/render";

/** The design note in the reading column: Literata, about 70 characters wide, math by KaTeX. */
export async function NoteView({ markdown, slug }: { markdown: string; slug: string }) {
  const html = await renderNote(markdown, { slug });
  return <article className="note max-w-[70ch] font-serif text-[1.05rem] leading-[1.7]" data-testid="note" dangerouslySetInnerHTML={{ __html: html }} />;
}

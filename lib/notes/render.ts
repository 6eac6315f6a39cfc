import rehypeKatex from "rehype-katex";
import rehypeSanitize, { defaultSchema, type Options as SanitizeSchema } from "rehype-sanitize";
import rehypeStringify from "rehype-stringify";
import remarkGfm from "remark-gfm";
import remarkMath from "remark-math";
import remarkParse from "remark-parse";
import remarkRehype from "remark-rehype";
import { unified } from "unified";
import type { Element, Root, RootContent } from "hast";

/** Where a block's attachments are served; the only image source a note may use. */
export const attachmentUrl = (slug: string, name: string) =>
  `/blocks/${encodeURIComponent(slug)}/attachments/${encodeURIComponent(name)}`;

const ATTACHMENT_SRC = /^\/blocks\/[a-z0-9-]+\/attachments\/[A-Za-z0-9._%-]+$/;

// Math classes must survive sanitising so rehype-katex, which runs after it, can find them.
const schema: SanitizeSchema = {
  ...defaultSchema,
  attributes: {
    ...defaultSchema.attributes,
    code: [["className", /^language-./, "math-inline", "math-display"]],
    span: [["className", "math-inline", "math-display"]],
    div: [["className", "math-display"]],
  },
  protocols: { ...defaultSchema.protocols, src: [] },
};

function walk(node: Root | Element, fn: (el: Element, parent: Root | Element, i: number) => void) {
  node.children.forEach((child: RootContent, i: number) => {
    if (child.type === "element") {
      fn(child, node, i);
      walk(child, fn);
    }
  });
}

/** A bare file name in an image (`![](divider.png)`, or `attachments/divider.png`) points at the block's attachment of that name. */
function rehypeAttachmentImages(slug: string) {
  return () => (tree: Root) =>
    walk(tree, (el) => {
      const src = el.tagName === "img" ? String(el.properties?.src ?? "") : "";
      const name = /^(?:attachments\/)?([A-Za-z0-9._-]+)$/.exec(src)?.[1];
      if (name) el.properties.src = attachmentUrl(slug, name);
    });
}

/** After sanitising: drop any image that is not one of our attachment URLs. */
function rehypeOnlyAttachmentImages() {
  return (tree: Root) => {
    const drop: { parent: Root | Element; i: number }[] = [];
    walk(tree, (el, parent, i) => {
      if (el.tagName === "img" && !ATTACHMENT_SRC.test(String(el.properties?.src ?? ""))) drop.push({ parent, i });
    });
    for (const { parent, i } of drop.reverse()) parent.children.splice(i, 1);
  };
}

/**
 * Notes write display math as `$$…$$` spanning lines, with text right after the opening `$$`; remark-math reads
 * that as a fence with an info string and swallows the rest of the note. Put such delimiters on lines of their own.
 */
export function normaliseDisplayMath(markdown: string): string {
  return markdown.replace(/^\$\$(?!\s*$)([^$]+?)\$\$[ \t]*$/gm, (_m, body: string) => `$$\n${body.trim()}\n$$`);
}

/** A block's note (markdown, $math$) to safe HTML. Sanitising runs before KaTeX so KaTeX's own markup stays intact. */
export async function renderNote(markdown: string, opts: { slug: string }): Promise<string> {
  const file = await unified()
    .use(remarkParse)
    .use(remarkGfm)
    .use(remarkMath)
    .use(remarkRehype)
    .use(rehypeAttachmentImages(opts.slug))
    .use(rehypeSanitize, schema)
    .use(rehypeOnlyAttachmentImages)
    .use(rehypeKatex)
    .use(rehypeStringify)
    .process(normaliseDisplayMath(markdown));
  return String(file);
}

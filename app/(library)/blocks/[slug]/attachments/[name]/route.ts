import { getAttachment } from "@/lib/attachments/attachments";
import { requestContext } from "@/lib/context";
import { isAppError } from "@/lib/errors";

// A schematic image shown in a note. SVGs were sanitised on upload; the CSP here stops script even so.
export async function GET(_req: Request, ctx: { params: Promise<{ slug: string; name: string }> }) {
  const { slug, name } = await ctx.params;
  try {
    const a = await getAttachment(await requestContext(_req), { slug, name: decodeURIComponent(name) });
    return new Response(new Uint8Array(a.bytes), {
      headers: {
        "Content-Type": a.contentType,
        "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'; sandbox",
        "X-Content-Type-Options": "nosniff",
        "Cache-Control": "private, max-age=300",
        ETag: `"${a.sha256}"`,
      },
    });
  } catch (err) {
    if (isAppError(err) && (err.code === "not_found" || err.code === "forbidden")) return new Response("not found", { status: 404 });
    throw err;
  }
}

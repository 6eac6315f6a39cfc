import NextAuth from "next-auth";
import { authOptions } from "@/lib/auth/auth-options";

// next-auth's own endpoints (csrf, callback/<provider>, session, signout) under /api/auth.
// Options are built per request so NEXTAUTH_SECRET is read at run time, not at build time.
type Ctx = { params: Promise<{ nextauth: string[] }> };

function handler(req: Request, ctx: Ctx) {
  return NextAuth(req as never, ctx as never, authOptions());
}

export { handler as GET, handler as POST };

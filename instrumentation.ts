// Runs once when the server starts: load the check engine's sandbox children now, so the first live preview
// an engineer asks for does not wait seconds for them.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { warmEngine } = await import("./checks");
  warmEngine();
}

import { describe, expect, it, vi } from "vitest";

// Next bundles the engine client into every route that uses it; each copy of the module must find the same two
// lanes, or one web process ends up holding a pair of ~110 MB sandbox children per route.
describe("sandbox lanes", () => {
  it("are one pair per process, however many copies of the client module are loaded", async () => {
    const first = await import("@/checks/sandbox/client");
    vi.resetModules();
    const second = await import("@/checks/sandbox/client");
    expect(second).not.toBe(first); // a fresh module instance, as a second bundle would be
    expect(second.verifyLane).toBe(first.verifyLane);
    expect(second.previewLane).toBe(first.previewLane);
    expect(first.previewLane).not.toBe(first.verifyLane);
  });
});

import { describe, expect, it } from "vitest";
import { parseBlock } from "@/checks";
import { MAX_PARAMS } from "@/checks/block/params";
import { consumeEngine, engineCall } from "@/lib/api/engine-limit";
import type { Caller } from "@/lib/auth/caller";

const block = (n: number) => `---
slug: many-params
title: Many parameters
category: other
summary: A parameter list as long as asked.
params:
${Array.from({ length: n }, (_, i) => `  - { name: R${i}, value: 1 kohm, tol: 1% }`).join("\n")}
---
Note.

\`\`\`check
check("first resistor positive", R0 > 0 ohm)
\`\`\`
`;

describe("engine work limits", () => {
  it("caps parameters per block with an error on the params line", () => {
    expect(parseBlock(block(MAX_PARAMS)).errors).toEqual([]);
    const { block: parsed, errors } = parseBlock(block(MAX_PARAMS + 1));
    expect(parsed).toBeNull();
    expect(errors).toEqual([{ message: `at most ${MAX_PARAMS} parameters per block (this one has ${MAX_PARAMS + 1})`, line: 7 }]);
  });

  it("charges a call's budget by the wall time of its work, not one point whatever it costs", async () => {
    process.env.ASSAY_ENGINE_POINTS = "10";
    const caller = { user: { id: 1, email: "a@b.test", name: "a" }, memberships: [], token: { id: 4242, teamId: 1, scope: "read" } } as Caller;
    // 1 point for the call, then 1300 ms of work at 250 ms a point: 5 more.
    await engineCall(caller, "x", "evaluate", () => new Promise((r) => setTimeout(r, 1300)));
    let admitted = 0;
    for (let i = 0; i < 10; i++) {
      try { await consumeEngine(caller, "x", "evaluate"); admitted++; } catch { break; }
    }
    expect(admitted).toBe(4);
  });
});

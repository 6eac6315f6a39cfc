import type { EntityManager } from "@mikro-orm/postgresql";
import { createHash } from "node:crypto";
import { BlockSchema, BlockVersionSchema, MembershipSchema, TeamSchema, UserSchema, type Category } from "../../entities";

// Deterministic generated blocks: words of the trade combined so queries hit a realistic share of them.
const kinds: { category: Category; words: string[]; tags: string[] }[] = [
  { category: "limiter", words: ["soft limiter", "diode clamp", "zener clamp", "amplitude limiter"], tags: ["diode", "protection"] },
  { category: "oscillator", words: ["bridge oscillator", "phase-shift oscillator", "astable", "sine source"], tags: ["sine", "timing"] },
  { category: "filter", words: ["1 kHz notch", "anti-alias low-pass", "AC coupling high-pass", "Sallen-Key low-pass"], tags: ["passive", "active"] },
  { category: "reference", words: ["zener reference", "bandgap-style reference", "shunt reference"], tags: ["precision"] },
  { category: "amplifier", words: ["non-inverting gain stage", "buffer", "transimpedance stage"], tags: ["op-amp"] },
];

export async function generateBlocks(em: EntityManager, count: number): Promise<{ userId: number; teamId: number }> {
  const team = em.create(TeamSchema, { slug: "bench", name: "Bench team" });
  const user = em.create(UserSchema, { email: "bench@bench.test", name: "Bench", passwordHash: null });
  em.create(MembershipSchema, { user, team, role: "author" });
  await em.flush();
  for (let i = 0; i < count; i++) {
    const k = kinds[i % kinds.length];
    const word = k.words[Math.floor(i / kinds.length) % k.words.length];
    const slug = `bench-${k.category}-${i}`;
    const title = `${word[0].toUpperCase()}${word.slice(1)} variant ${i}`;
    const text = `---\nslug: ${slug}\ntitle: ${title}\ncategory: ${k.category}\ntags: [${k.tags.join(", ")}]\nsummary: Generated ${word} for the search benchmark.\nparams:\n  - { name: R, value: ${1 + (i % 90)} kohm, tol: 1% }\n---\nA ${word} with R = ${1 + (i % 90)} kΩ.\n`;
    const block = em.create(BlockSchema, {
      slug, team, title, summary: `Generated ${word} for the search benchmark.`, category: k.category, tags: k.tags, hazard: [],
      visibility: i % 3 === 0 ? "public" : "team", head: null, forkedFrom: null, archived: false,
    });
    const version = em.create(BlockVersionSchema, {
      block, number: 1, text, params: [{ name: "R", value: `${1 + (i % 90)} kohm`, tol: "1%", si: (1 + (i % 90)) * 1000, unit: "ohm" }],
      contentHash: createHash("sha256").update(text).digest("hex"), author: user, message: "generated",
    });
    block.head = version;
  }
  await em.flush();
  return { userId: user.id, teamId: team.id };
}

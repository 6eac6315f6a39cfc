import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import type { EntityManager } from "@mikro-orm/postgresql";
import { parseBlock } from "@/checks";
import { BlockSchema, ModelSchema, ReviewSchema, UserSchema } from "@/entities";
import { loadCaller } from "@/lib/auth/load-caller";
import { setVisibility } from "@/lib/blocks/archive";
import { createBlock } from "@/lib/blocks/create";
import { forkBlock } from "@/lib/blocks/fork";
import { contextFor } from "@/lib/context";
import { addVersion } from "@/lib/blocks/versions";
import { uploadModel } from "@/lib/models/upload";
import { decide, requestReview } from "@/lib/reviews/reviews";

// Fenwick's library as the demo shows it: every content block, a few published, one fork, one retuned block,
// two approved versions and one waiting for sign-off. Each step checks first, so a second run creates nothing.
const AUTHOR = "nadia.okafor@fenwick.test";
const MAINTAINER = "tomas.reyes@fenwick.test";
const PUBLIC = ["wien-bridge-sine-1k", "rc-lowpass-antialias", "opamp-soft-limiter", "sallen-key-lowpass-unity"];
const FORK = {
  from: "rc-lowpass-antialias", slug: "rc-lowpass-antialias-5k1", title: "First-order anti-alias low-pass, 5.1 k / 9.1 nF",
  params: { R: "5.1 kohm", C: "9.1 nF" },
};
// A second version of the fork's parent, so the fork shows that its parent moved on and compare has a change.
const RETUNE = {
  slug: "rc-lowpass-antialias", params: { R: "4.3 kohm", C: "11 nF" },
  message: "11 nF C0G is the stocked value; R to 4.3 kohm keeps the corner at 3.4 kHz",
};
const APPROVE = { slug: "wien-bridge-sine-1k", version: 1, comment: "Start-up margin and amplitude agree with my bench notes." };
// The retuned low-pass waits for sign-off against its approved first version, so the review queue has an entry
// with its checks and what changed.
const SIGN_OFF = { slug: RETUNE.slug, approved: 1, waiting: 2, comment: "3.4 kHz corner sits inside the ADC front end's alias budget." };

const blocksDir = () => path.join(process.env.ASSAY_ROOT || process.cwd(), "content/blocks");
// Fenwick's own model files and the blocks that include them (content/team/fenwick): models first, so the blocks resolve.
const teamDir = (sub: string) => path.join(process.env.ASSAY_ROOT || process.cwd(), "content/team/fenwick", sub);

export async function seedLibrary(em: EntityManager): Promise<{ created: number }> {
  const nadia = await em.findOne(UserSchema, { email: AUTHOR });
  const tomas = await em.findOne(UserSchema, { email: MAINTAINER });
  if (!nadia || !tomas) throw new Error("seed the demo people first");
  const author = await loadCaller(em, nadia.id);
  const maintainer = await loadCaller(em, tomas.id);
  const exists = async (slug: string) => (await em.fork().count(BlockSchema, { slug })) > 0;
  let created = 0;

  for (const name of readdirSync(teamDir("models")).filter((f) => f.endsWith(".lib")).sort()) {
    if (await em.fork().count(ModelSchema, { team: { slug: "fenwick" }, name })) continue;
    await uploadModel(await contextFor(author), { team: "fenwick", name, text: readFileSync(path.join(teamDir("models"), name), "utf8"), message: "from the component engineering notebook" });
  }
  const files = [
    ...readdirSync(blocksDir()).filter((f) => f.endsWith(".md")).sort().map((f) => path.join(blocksDir(), f)),
    ...readdirSync(teamDir("blocks")).filter((f) => f.endsWith(".md")).sort().map((f) => path.join(teamDir("blocks"), f)),
  ];
  for (const file of files) {
    const text = readFileSync(file, "utf8");
    // The engine reads the slug; a file it cannot read is tried anyway, so the refusal is logged below.
    const slug = parseBlock(text).block?.slug ?? path.basename(file, ".md");
    if (await exists(slug)) continue;
    try {
      // Authors create; publishing is a maintainer's decision (the roles table), made just below.
      await createBlock(await contextFor(author), { team: "fenwick", text, message: "imported from the bench notebook" });
      created++;
    } catch (err) {
      console.warn(`[assay] seed: ${file} was not imported: ${(err as Error).message}`);
    }
  }
  for (const slug of PUBLIC) {
    if (await exists(slug)) await setVisibility(await contextFor(maintainer), { slug, visibility: "public" });
  }
  if ((await exists(FORK.from)) && !(await exists(FORK.slug))) {
    await forkBlock(await contextFor(author), { source: FORK.from, slug: FORK.slug, title: FORK.title, params: FORK.params });
    created++;
  }
  const retuned = await em.fork().findOne(BlockSchema, { slug: RETUNE.slug }, { populate: ["head"] });
  if (retuned?.head?.number === 1) {
    await addVersion(await contextFor(author), { slug: RETUNE.slug, params: RETUNE.params, baseVersion: 1, message: RETUNE.message });
  }
  const approved = await em.fork().findOne(BlockSchema, { slug: APPROVE.slug });
  if (approved) {
    const done = await em.fork().count(ReviewSchema, { version: { block: approved.id, number: APPROVE.version }, decision: "approved" });
    if (!done) await decide(await contextFor(maintainer), { slug: APPROVE.slug, version: APPROVE.version, decision: "approved", comment: APPROVE.comment });
  }
  const lowpass = await em.fork().findOne(BlockSchema, { slug: SIGN_OFF.slug }, { populate: ["head"] });
  if (lowpass?.head?.number === SIGN_OFF.waiting && !(await em.fork().count(ReviewSchema, { version: { block: lowpass.id } }))) {
    await decide(await contextFor(maintainer), { slug: SIGN_OFF.slug, version: SIGN_OFF.approved, decision: "approved", comment: SIGN_OFF.comment });
    await requestReview(await contextFor(author), { slug: SIGN_OFF.slug, version: SIGN_OFF.waiting });
  }
  return { created };
}

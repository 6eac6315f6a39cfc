import type { EntityManager } from "@mikro-orm/postgresql";

/**
 * The demo library from content/blocks, created through the block services so every version gets its run.
 * Filled in by the blocks service (lib/blocks): until then it creates nothing.
 */
export async function seedLibrary(_em: EntityManager): Promise<{ created: number }> {
  return { created: 0 };
}

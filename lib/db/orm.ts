import { MikroORM, type EntityManager } from "@mikro-orm/postgresql";
import config from "../../mikro-orm.config";

// One ORM per process; Next's dev reloads would otherwise open a pool per reload.
const holder = globalThis as unknown as { __assayOrm?: Promise<MikroORM> };

export function getOrm(): Promise<MikroORM> {
  holder.__assayOrm ??= MikroORM.init(config).catch((err) => {
    holder.__assayOrm = undefined;
    throw err;
  });
  return holder.__assayOrm;
}

/** A fresh EntityManager for one request, job or script step (identity map per unit of work). */
export async function getEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}

/** Run fn with its own EntityManager. */
export async function withEm<T>(fn: (em: EntityManager) => Promise<T>): Promise<T> {
  return fn(await getEm());
}

/** Closes the ORM's pool and the queue client's, so a script or test process can exit. */
export async function closeOrm(): Promise<void> {
  await (await import("../queue/boss")).stopBoss();
  const orm = holder.__assayOrm;
  holder.__assayOrm = undefined;
  if (orm) await (await orm).close(true);
}

import { errors, MeiliError } from "./errors";
import { IndexState } from "./index-state";
import { filterPredicate } from "./search";
import { Store } from "./store";
import { isoDuration, newTask, summary, type PendingTask, type TaskPayload, type TaskRecord, type TaskType } from "./tasks";

const KEEP_FINISHED = 2000;
const MAX_BATCH = 100;

interface TaskFile {
  nextUid: number;
  tasks: TaskRecord[];
}

// Holds the indexes and runs their write tasks one at a time, in the order
// they were accepted, persisting after each; reads see the last finished state.
export class Engine {
  readonly indexes = new Map<string, IndexState>();
  private tasks: TaskRecord[] = [];
  private queue: PendingTask[] = [];
  private nextUid = 0;
  private running: Promise<void> | null = null;

  constructor(private store: Store) {
    store.removeStrayTemps();
    for (const snap of store.loadIndexes()) this.indexes.set(snap.uid, IndexState.fromSnapshot(snap));
    const saved = store.readJson<TaskFile>("tasks.json");
    if (saved) {
      this.nextUid = saved.nextUid;
      this.tasks = saved.tasks;
    }
    // Tasks accepted before a stop are still on disk with their payload: run them now.
    for (const f of store.list("queue")) {
      const pending = store.readJson<PendingTask>(`queue/${f}`);
      if (!pending) continue;
      pending.task.status = "enqueued";
      this.queue.push(pending);
      if (!this.tasks.some((t) => t.uid === pending.task.uid)) this.tasks.push(pending.task);
      this.nextUid = Math.max(this.nextUid, pending.task.uid + 1);
    }
    this.tasks = this.tasks.map((t) => this.queue.find((p) => p.task.uid === t.uid)?.task ?? t);
    this.kick();
  }

  index(uid: string): IndexState {
    const idx = this.indexes.get(uid);
    if (!idx) throw errors.indexNotFound(uid);
    return idx;
  }

  task(uid: number): TaskRecord {
    const t = this.tasks.find((x) => x.uid === uid);
    if (!t) throw errors.taskNotFound(String(uid));
    return t;
  }

  allTasks(): TaskRecord[] {
    return this.tasks;
  }

  enqueue(indexUid: string, type: TaskType, payload: TaskPayload, details: Record<string, unknown>) {
    const task = newTask(this.nextUid++, indexUid, type, details);
    // On disk before the 202, so an accepted write survives a restart.
    this.store.writeJsonSync(`queue/${task.uid}.json`, { task, payload });
    this.tasks.push(task);
    this.queue.push({ task, payload });
    this.kick();
    return summary(task);
  }

  private kick() {
    if (this.running || this.queue.length === 0) return;
    this.running = new Promise<void>((resolve) => setImmediate(resolve)).then(() => this.drain()).finally(() => {
      this.running = null;
      this.kick();
    });
  }

  // Runs the queued tasks as one batch, like Meilisearch's autobatching: each
  // is applied in memory in order, then every touched index is saved once, and
  // only then are the tasks marked finished.
  private async drain() {
    while (this.queue.length) {
      const batch = this.queue.slice(0, MAX_BATCH);
      const touched = new Set<string>();
      const started = Date.now();
      const outcomes: ("succeeded" | "failed")[] = [];
      for (const { task } of batch) {
        task.status = "processing";
        task.startedAt = new Date(started).toISOString();
        task.batchUid = batch[0].task.uid;
      }
      for (const { task, payload } of batch) {
        try {
          Object.assign(task.details, this.apply(task.indexUid!, payload));
          outcomes.push("succeeded");
          touched.add(task.indexUid!);
        } catch (e) {
          const err = e instanceof MeiliError ? e : errors.internal(String((e as Error)?.message ?? e));
          outcomes.push("failed");
          task.error = err.toJSON();
          for (const k of ["indexedDocuments", "deletedDocuments"]) if (k in task.details) task.details[k] = 0;
        }
      }
      await this.persist(touched);
      // The status is what the client waits on: set it after the writes.
      const finished = new Date().toISOString();
      batch.forEach(({ task }, i) => {
        task.status = outcomes[i];
        task.finishedAt = finished;
        task.duration = isoDuration(Date.now() - started);
      });
      this.queue.splice(0, batch.length);
      this.trimTasks();
      await this.store.writeJson("tasks.json", { nextUid: this.nextUid, tasks: this.tasks } satisfies TaskFile);
      for (const { task } of batch) await this.store.remove(`queue/${task.uid}.json`);
    }
  }

  // A failed write (a full disk) is retried: the tasks are already applied in
  // memory and stay "processing" until their result is on disk.
  private async persist(touched: Set<string>) {
    for (;;) {
      try {
        for (const uid of touched) {
          const idx = this.indexes.get(uid);
          if (idx) await this.store.saveIndex(idx.snapshot());
          else await this.store.deleteIndex(uid);
        }
        return;
      } catch (e) {
        console.error(`search server: could not save the index, retrying in 1 s: ${(e as Error).message}`);
        await new Promise((r) => setTimeout(r, 1000));
      }
    }
  }

  private trimTasks() {
    const finished = this.tasks.filter((t) => t.status === "succeeded" || t.status === "failed");
    if (finished.length <= KEEP_FINISHED) return;
    const drop = new Set(finished.slice(0, finished.length - KEEP_FINISHED).map((t) => t.uid));
    this.tasks = this.tasks.filter((t) => !drop.has(t.uid));
  }

  private orCreate(uid: string): IndexState {
    let idx = this.indexes.get(uid);
    if (!idx) this.indexes.set(uid, (idx = new IndexState(uid)));
    return idx;
  }

  private apply(uid: string, p: TaskPayload): Record<string, unknown> {
    switch (p.kind) {
      case "createIndex": {
        if (this.indexes.has(uid)) throw errors.indexAlreadyExists(uid);
        this.indexes.set(uid, new IndexState(uid, p.primaryKey));
        return {};
      }
      case "updateIndex":
        this.index(uid).setPrimaryKey(p.primaryKey);
        return {};
      case "deleteIndex": {
        const idx = this.index(uid);
        this.indexes.delete(uid);
        return { deletedDocuments: idx.docs.size };
      }
      case "addDocuments": {
        const existed = this.indexes.has(uid);
        const idx = this.orCreate(uid);
        try {
          return { indexedDocuments: idx.addDocuments(p.documents, p.mode, p.primaryKey) };
        } catch (e) {
          if (!existed) this.indexes.delete(uid);
          throw e;
        }
      }
      case "deleteDocuments":
        return { deletedDocuments: this.index(uid).deleteDocuments(p.ids) };
      case "deleteByFilter": {
        const idx = this.index(uid);
        const pred = filterPredicate(idx, p.filter);
        const keys = pred ? [...idx.flats].filter(([, f]) => pred(f)).map(([k]) => k) : [];
        return { deletedDocuments: idx.deleteDocuments(keys) };
      }
      case "clearDocuments":
        return { deletedDocuments: this.index(uid).clear() };
      case "updateSettings":
        this.orCreate(uid).updateSettings(p.settings);
        return {};
    }
  }

  // Resolves once every accepted task has run and been written.
  async idle() {
    while (this.running) await this.running;
  }
}

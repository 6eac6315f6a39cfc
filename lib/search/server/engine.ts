import { errors, MeiliError } from "./errors";
import { IndexState } from "./index-state";
import { filterPredicate } from "./search";
import { Store } from "./store";
import { isoDuration, newTask, summary, type PendingTask, type TaskPayload, type TaskRecord, type TaskType } from "./tasks";

const KEEP_FINISHED = 2000;

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

  private async drain() {
    while (this.queue.length) {
      const { task, payload } = this.queue[0];
      const started = Date.now();
      task.status = "processing";
      task.startedAt = new Date(started).toISOString();
      task.batchUid = task.uid;
      try {
        Object.assign(task.details, await this.apply(task.indexUid!, payload));
        task.status = "succeeded";
      } catch (e) {
        const err = e instanceof MeiliError ? e : errors.internal(String((e as Error)?.message ?? e));
        task.status = "failed";
        task.error = err.toJSON();
        for (const k of ["indexedDocuments", "deletedDocuments"]) if (k in task.details) task.details[k] = 0;
      }
      task.finishedAt = new Date().toISOString();
      task.duration = isoDuration(Date.now() - started);
      this.queue.shift();
      this.trimTasks();
      await this.store.writeJson("tasks.json", { nextUid: this.nextUid, tasks: this.tasks } satisfies TaskFile);
      await this.store.remove(`queue/${task.uid}.json`);
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

  private async apply(uid: string, p: TaskPayload): Promise<Record<string, unknown>> {
    switch (p.kind) {
      case "createIndex": {
        if (this.indexes.has(uid)) throw errors.indexAlreadyExists(uid);
        const idx = new IndexState(uid, p.primaryKey);
        this.indexes.set(uid, idx);
        await this.store.saveIndex(idx.snapshot());
        return {};
      }
      case "updateIndex": {
        const idx = this.index(uid);
        idx.setPrimaryKey(p.primaryKey);
        await this.store.saveIndex(idx.snapshot());
        return {};
      }
      case "deleteIndex": {
        const idx = this.index(uid);
        this.indexes.delete(uid);
        await this.store.deleteIndex(uid);
        return { deletedDocuments: idx.docs.size };
      }
      case "addDocuments": {
        const existed = this.indexes.has(uid);
        const idx = this.orCreate(uid);
        try {
          const n = idx.addDocuments(p.documents, p.mode, p.primaryKey);
          await this.store.saveIndex(idx.snapshot());
          return { indexedDocuments: n };
        } catch (e) {
          if (!existed) this.indexes.delete(uid);
          throw e;
        }
      }
      case "deleteDocuments": {
        const idx = this.index(uid);
        const n = idx.deleteDocuments(p.ids);
        await this.store.saveIndex(idx.snapshot());
        return { deletedDocuments: n };
      }
      case "deleteByFilter": {
        const idx = this.index(uid);
        const pred = filterPredicate(idx, p.filter);
        const keys = pred ? [...idx.flats].filter(([, f]) => pred(f)).map(([k]) => k) : [];
        const n = idx.deleteDocuments(keys);
        await this.store.saveIndex(idx.snapshot());
        return { deletedDocuments: n };
      }
      case "clearDocuments": {
        const idx = this.index(uid);
        const n = idx.clear();
        await this.store.saveIndex(idx.snapshot());
        return { deletedDocuments: n };
      }
      case "updateSettings": {
        const idx = this.orCreate(uid);
        idx.updateSettings(p.settings);
        await this.store.saveIndex(idx.snapshot());
        return {};
      }
    }
  }

  // Resolves once every accepted task has run and been written.
  async idle() {
    while (this.running) await this.running;
  }
}

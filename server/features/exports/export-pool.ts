import type { Db } from "../../db/client.ts";
import { AppError } from "../../lib/errors.ts";
import { workerPool } from "../../lib/workers/pool.ts";
import type { Gathered, GatherTask } from "./export.worker.ts";

/** One thread: exports are occasional, and one at a time leaves the other core to the request thread. */
const EXPORT_QUEUE = 32;
let exportTimeoutMs = 120_000;
/** Sets the time limit for gathering one export's datasets (WORK_TIME_LIMIT_S); the pool is the process's. */
export function setExportTimeLimit(ms: number) {
  exportTimeoutMs = ms;
}
const pool = workerPool(new URL("./export.worker.ts", import.meta.url), { threads: 1, queue: EXPORT_QUEUE });

/** Gathers datasets off the request thread (export.worker.ts). Too many waiting → 429; too slow → 503. */
export async function gatherInWorker(db: Db, task: Omit<GatherTask, "databaseFile">): Promise<Gathered> {
  const p = pool.get();
  if (p.queueSize >= EXPORT_QUEUE) throw new AppError("rate_limited", "Too many exports are being prepared right now. Try again in a minute.");
  try {
    return (await p.run({ ...task, databaseFile: db.$client.name } satisfies GatherTask, { signal: AbortSignal.timeout(exportTimeoutMs) })) as Gathered;
  } catch (e) {
    const name = (e as Error)?.name;
    if (name === "AbortError" || name === "TimeoutError")
      throw new AppError("unavailable", "This export took too long to prepare and was stopped. Try again later, or export one dataset at a time.");
    throw e;
  }
}

/** For shutdown and tests: stops the worker thread. */
export const closeExportPool = () => pool.close();

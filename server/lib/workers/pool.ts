import { fileURLToPath } from "node:url";
import { Piscina } from "piscina";

/**
 * A pool of worker threads running `module`'s default export (TypeScript, loaded through boot.worker.mjs),
 * made on first use and closed on shutdown. Threads end after a minute idle, so an idle server holds none.
 */
export function workerPool(module: URL, opts: { threads: number; queue: number }) {
  let pool: Piscina | null = null;
  return {
    get(): Piscina {
      pool ??= new Piscina({
        filename: fileURLToPath(new URL("./boot.worker.mjs", import.meta.url)),
        workerData: { module: module.href },
        minThreads: 0,
        maxThreads: opts.threads,
        maxQueue: opts.queue,
        idleTimeout: 60_000,
      });
      return pool;
    },
    async close() {
      const p = pool;
      pool = null;
      await p?.destroy();
    },
    stats(): { threads: number; queued: number } {
      return { threads: pool?.threads.length ?? 0, queued: pool?.queueSize ?? 0 };
    },
  };
}

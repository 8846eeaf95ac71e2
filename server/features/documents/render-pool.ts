import type { DocumentProps } from "@react-pdf/renderer";
import type { ReactElement } from "react";
import { AppError, notFound } from "../../lib/errors.ts";
import { toHostTree } from "../../lib/pdf/host-tree.ts";
import { workerPool } from "../../lib/workers/pool.ts";
import { NOT_FOUND_IN_WORKER, type DocumentJob } from "./registry.ts";
import type { RenderResult, RenderTask } from "./render.worker.ts";

/** Documents laid out at once, each in its own worker thread: the request thread only gathers the data. */
export const RENDER_THREADS = 2;
/** Documents waiting their turn beyond those being laid out; more are refused with "try again". */
export const RENDER_QUEUE = 24;
/** The longest one document may take to lay out before it is stopped and refused (WORK_TIME_LIMIT_S sets it). */
export const RENDER_TIMEOUT_MS = 120_000;
let renderTimeoutMs = RENDER_TIMEOUT_MS;
/** Sets the time limit for the process's renders; the pool is the process's, so the limit is too. */
export function setRenderTimeLimit(ms: number) {
  renderTimeoutMs = ms;
}

const pool = workerPool(new URL("./render.worker.ts", import.meta.url), { threads: RENDER_THREADS, queue: RENDER_QUEUE });

/**
 * Lays out a document off the request thread, and the PDF comes back. A named document (registry.ts) goes
 * as its data, or as what to load, and is built in the worker; any other element is expanded here to react-pdf's primitives
 * first (host-tree.ts), which suits documents of one object. Too many waiting → 429; past the time limit →
 * the worker is stopped and 503 says so, plainly.
 */
export async function renderPdf(document: ReactElement<DocumentProps> | DocumentJob, opts: { timeoutMs?: number } = {}): Promise<{ pdf: Buffer; pages: number }> {
  const task: RenderTask = "doc" in document ? { job: document } : { tree: toHostTree(document) };
  const p = pool.get();
  if (p.queueSize >= RENDER_QUEUE) throw new AppError("rate_limited", "Too many documents are being prepared right now. Try again in a minute.");
  try {
    const { bytes, pages } = (await p.run(task, { signal: AbortSignal.timeout(opts.timeoutMs ?? renderTimeoutMs) })) as RenderResult;
    return { pdf: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength), pages };
  } catch (e) {
    const name = (e as Error)?.name;
    if (name === "AbortError" || name === "TimeoutError") {
      throw new AppError("unavailable", "This document took too long to prepare and was stopped. Try a smaller selection (fewer objects or mountings), or try again later.");
    }
    const message = String((e as Error)?.message);
    if (message.startsWith(NOT_FOUND_IN_WORKER)) throw notFound(message.slice(NOT_FOUND_IN_WORKER.length));
    if (/queue is at limit/i.test(message)) throw new AppError("rate_limited", "Too many documents are being prepared right now. Try again in a minute.");
    throw e;
  }
}

/** For shutdown and tests: stops the worker threads. */
export const closeRenderPool = () => pool.close();

/** How many worker threads the pool has now and how many documents wait (for tests and the bench). */
export const renderPoolStats = () => pool.stats();

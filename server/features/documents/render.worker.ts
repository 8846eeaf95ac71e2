import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import { PDFDocument } from "pdf-lib";
import { createElement, type FunctionComponent, type ReactElement } from "react";
import { openReadOnly, type DbHandle } from "../../db/client.ts";
import { registerFonts } from "../../lib/pdf/fonts.ts";
import { fromHostTree, revive, type HostNode } from "../../lib/pdf/host-tree.ts";
import { NOT_FOUND_IN_WORKER, WORKER_DOCUMENTS, WORKER_LOADERS, type DocumentJob } from "./registry.ts";

registerFonts();

/** What the pool sends: a named document with its data, or a document already expanded to primitives. */
export type RenderTask = { job: DocumentJob } | { tree: HostNode };
/** What comes back: the PDF's bytes and its page count (counted here, so the request thread need not parse it). */
export type RenderResult = { bytes: Uint8Array; pages: number };

/** This thread's read-only connections, one per database file, kept while the thread lives. */
const connections = new Map<string, DbHandle>();
function readOnly(file: string): DbHandle {
  let h = connections.get(file);
  if (!h) {
    h = openReadOnly(file);
    connections.set(file, h);
  }
  return h;
}

function propsOf(job: DocumentJob): object {
  if ("props" in job) return revive(job.props) as object;
  const load = WORKER_LOADERS[job.doc];
  const { db, sqlite } = readOnly(job.load.databaseFile);
  // One read transaction: every row from the same moment, whatever is written meanwhile.
  const data = sqlite.transaction(() => load(db, revive(job.load.args) as typeof job.load.args))();
  if (!data) throw new Error(`${NOT_FOUND_IN_WORKER}One of those objects`);
  return { meta: revive(job.meta), data };
}

/** Lays out one document in this worker thread and returns its PDF bytes and page count. */
export default async function render(task: RenderTask): Promise<RenderResult> {
  let element: ReactElement;
  if ("job" in task) {
    const component = WORKER_DOCUMENTS[task.job.doc] as FunctionComponent<object> | undefined;
    if (!component) throw new Error(`render worker: no document called "${task.job.doc}"`);
    element = createElement(component, propsOf(task.job));
  } else element = fromHostTree(task.tree) as ReactElement;
  const pdf = await renderToBuffer(element as ReactElement<DocumentProps>);
  const pages = (await PDFDocument.load(pdf, { updateMetadata: false })).getPageCount();
  return { bytes: new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength), pages };
}

import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import { createElement, type FunctionComponent, type ReactElement } from "react";
import { registerFonts } from "../../lib/pdf/fonts.ts";
import { fromHostTree, revive, type HostNode } from "../../lib/pdf/host-tree.ts";
import { WORKER_DOCUMENTS, type DocumentJob } from "./registry.ts";

registerFonts();

/** What the pool sends: a named document with its data, or a document already expanded to primitives. */
export type RenderTask = { job: DocumentJob } | { tree: HostNode };

/** Lays out one document in this worker thread and returns its PDF bytes. */
export default async function render(task: RenderTask): Promise<Uint8Array> {
  let element: ReactElement;
  if ("job" in task) {
    const component = WORKER_DOCUMENTS[task.job.doc] as FunctionComponent<object> | undefined;
    if (!component) throw new Error(`render worker: no document called "${task.job.doc}"`);
    element = createElement(component, revive(task.job.props) as object);
  } else element = fromHostTree(task.tree) as ReactElement;
  const pdf = await renderToBuffer(element as ReactElement<DocumentProps>);
  return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
}

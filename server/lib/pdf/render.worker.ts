import { renderToBuffer, type DocumentProps } from "@react-pdf/renderer";
import type { ReactElement } from "react";
import { registerFonts } from "./fonts.ts";
import { fromHostTree, type HostNode } from "./host-tree.ts";

registerFonts();

/** Lays out one document in this worker thread and returns its PDF bytes. */
export default async function render(tree: HostNode): Promise<Uint8Array> {
  const pdf = await renderToBuffer(fromHostTree(tree) as ReactElement<DocumentProps>);
  return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
}

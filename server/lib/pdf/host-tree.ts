import { createElement, Fragment, isValidElement, type ReactElement, type ReactNode } from "react";

/**
 * A document as plain data, so it can be laid out in a worker thread: every component of ours is called
 * here (they are plain functions of their props, with no hooks or state), leaving only react-pdf's own
 * primitives ("DOCUMENT", "PAGE", "VIEW", "TEXT", "IMAGE", "SVG"…) with their props. Structured clone
 * carries it to the worker, which turns it back into elements and lays it out.
 */
export type HostNode = string | number | null | HostNode[] | { t: string; p: Record<string, unknown>; c: HostNode[] };

/** The one function prop documents use: the page footer's "Page n of m". Sent as a marker, rebuilt in the worker. */
export const pageFooterText = ({ pageNumber, totalPages }: { pageNumber: number; totalPages: number }) => `Page ${pageNumber} of ${totalPages} · Produced by Reversa`;
const PAGE_FOOTER = "@@page-footer";

type AnyProps = Record<string, unknown> & { children?: ReactNode };

export function toHostTree(node: ReactNode): HostNode {
  if (node === null || node === undefined || typeof node === "boolean") return null;
  if (typeof node === "string" || typeof node === "number") return node;
  if (Array.isArray(node)) return node.map(toHostTree);
  if (!isValidElement(node)) throw new Error(`host tree: cannot send ${typeof node} to the renderer`);
  const el = node as ReactElement<AnyProps>;
  if (el.type === Fragment) return toHostTree(el.props.children);
  if (typeof el.type === "function") return toHostTree((el.type as (p: AnyProps) => ReactNode)(el.props));
  if (typeof el.type !== "string") throw new Error("host tree: only function components and react-pdf primitives can be sent");
  const { children, ...rest } = el.props;
  const p: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(rest)) {
    if (typeof v === "function") {
      if (v !== pageFooterText) throw new Error(`host tree: the function prop "${k}" cannot be sent to the renderer; use pageFooterText`);
      p[k] = PAGE_FOOTER;
    } else p[k] = v;
  }
  const c = toHostTree(children);
  return { t: el.type, p, c: c === null ? [] : Array.isArray(c) ? c : [c] };
}

/** Structured clone turns Buffers into Uint8Arrays; react-pdf's images want Buffers back. */
export function revive(v: unknown): unknown {
  if (v instanceof Uint8Array && !Buffer.isBuffer(v)) return Buffer.from(v.buffer, v.byteOffset, v.byteLength);
  if (Array.isArray(v)) return v.map(revive);
  if (v && typeof v === "object" && Object.getPrototypeOf(v) === Object.prototype) return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, revive(x)]));
  return v;
}

export function fromHostTree(node: HostNode, key?: number): ReactNode {
  if (node === null || typeof node === "string" || typeof node === "number") return node;
  if (Array.isArray(node)) return node.map((n, i) => fromHostTree(n, i));
  const props: Record<string, unknown> = { key };
  for (const [k, v] of Object.entries(node.p)) props[k] = v === PAGE_FOOTER ? pageFooterText : revive(v);
  return createElement(node.t, props, ...node.c.map((n, i) => fromHostTree(n, i)));
}

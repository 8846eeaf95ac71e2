import type { ReactNode } from "react";
import { Link } from "react-router";

export type Column<T> = {
  key: string;
  header: ReactNode;
  cell: (row: T) => ReactNode;
  /** Numbers and dates sit right. */
  align?: "right";
  /** More classes for the header cell and the body cells. */
  th?: string;
  td?: string;
  /** A header cell of its own (e.g. one that sorts), in place of the plain one. */
  head?: ReactNode;
};

/** The registers' first column: the object's number, linked to its page. */
export function objectNumberColumn<T extends { objectId: string; objectNumber: string }>(): Column<T> {
  return {
    key: "number",
    header: "Object number",
    th: "whitespace-nowrap",
    td: "whitespace-nowrap font-semibold num",
    cell: (row) => (
      <Link to={`/objects/${row.objectId}`} className="text-accent hover:underline">
        {row.objectNumber}
      </Link>
    ),
  };
}

const STICKY_HEAD = "sticky top-0 z-10 bg-paper-sheet text-ink-soft shadow-[0_1px_0_var(--color-stone)]";
const PLAIN_HEAD = "border-b border-stone text-ink-soft";

/** The studio's tables: a header row that stays in view, quiet rules, a row highlighted under the pointer. */
export function DataTable<T>({
  columns,
  rows,
  rowKey,
  head = "sticky",
  padX = "px-3",
  rowClassName = "border-b border-stone-light hover:bg-paper-deep/60",
  tableClassName = "w-full border-collapse text-sm",
}: {
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string;
  head?: "sticky" | "plain";
  padX?: string;
  rowClassName?: string;
  tableClassName?: string;
}) {
  const align = (c: Column<T>) => (c.align === "right" ? "text-right" : "text-left");
  return (
    <div className="overflow-x-auto">
      <table className={tableClassName}>
        <thead className={head === "sticky" ? STICKY_HEAD : PLAIN_HEAD}>
          <tr>
            {columns.map(
              (c) =>
                c.head ?? (
                  <th key={c.key} scope="col" className={`${padX} py-2.5 font-semibold ${align(c)} ${c.th ?? ""}`}>
                    {c.header}
                  </th>
                ),
            )}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={rowKey(row)} className={rowClassName}>
              {columns.map((c) => (
                <td key={c.key} className={`${padX} py-3 ${c.align === "right" ? "text-right" : ""} ${c.td ?? ""}`}>
                  {c.cell(row)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

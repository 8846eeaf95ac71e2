import { Link } from "react-router";
import type { ObjectListItem, ObjectStatus, ObjectType } from "@shared/schemas/objects.ts";
import { OBJECT_TYPE_LABELS } from "@shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "@shared/schemas/mountings.ts";
import type { Unit } from "@shared/domain/units.ts";
import { formatDate, sheetSize } from "@/lib/format.ts";
import { studioToday } from "@/lib/today.ts";
import { StatusBadge } from "./status-badge.tsx";
import { DataTable, type Column } from "@/components/ui/data-table.tsx";

export type SortKey = "objectNumber" | "title" | "maker" | "status" | "updatedAt" | "lastMountedOn" | "checkDueOn";
type Props = {
  items: ObjectListItem[];
  unit: Unit;
  sort?: SortKey;
  dir?: "asc" | "desc";
  onSort?: (key: SortKey) => void;
  showOwner?: boolean;
  /** Today as an ISO date (default: the browser's today): a check due on or before it is marked. */
  today?: string;
};

function SortHeader({ label, k, sort, dir, onSort, align = "left" }: { label: string; k: SortKey; align?: "left" | "right" } & Pick<Props, "sort" | "dir" | "onSort">) {
  const active = sort === k;
  const ariaSort = active ? (dir === "desc" ? "descending" : "ascending") : "none";
  return (
    <th scope="col" aria-sort={onSort ? ariaSort : undefined} className={`whitespace-nowrap px-3 py-2.5 font-semibold ${align === "right" ? "text-right" : "text-left"}`}>
      {onSort ? (
        <button type="button" onClick={() => onSort(k)} className="inline-flex items-center gap-1 hover:text-accent">
          {label}
          <span aria-hidden="true" className={active ? "text-accent" : "text-stone"}>
            {active && dir === "desc" ? "↓" : "↑"}
          </span>
        </button>
      ) : (
        label
      )}
    </th>
  );
}

/** The current mount in two short lines: how the object is held, then the window board and the glazing. */
function CurrentMount({ o }: { o: ObjectListItem }) {
  if (!o.currentMethod) return <span className="text-graphite">—</span>;
  const board = o.currentBoardGrade ? (BOARD_GRADE_LABELS[o.currentBoardGrade] ?? o.currentBoardGrade) : null;
  const glazing = o.currentGlazing ? (GLAZING_TYPE_LABELS[o.currentGlazing] ?? o.currentGlazing) : null;
  return (
    <>
      <span className="block">{ATTACHMENT_METHOD_LABELS[o.currentMethod] ?? o.currentMethod}</span>
      {(board || glazing) && <span className="mt-0.5 block text-xs text-graphite">{[board && `${board} board`, glazing].filter(Boolean).join(" · ")}</span>}
    </>
  );
}

function CheckDue({ on, today }: { on: string | null; today?: string }) {
  if (!on) return <span className="text-graphite">—</span>;
  const due = !!today && on <= today;
  return (
    <>
      <span className="block">{formatDate(on)}</span>
      {due && (
        <span className="mt-0.5 inline-flex items-center gap-1 text-xs font-medium text-warn">
          <span aria-hidden="true">▲</span>
          {on === today ? "Due today" : "Overdue"}
        </span>
      )}
    </>
  );
}

type Cell = Column<ObjectListItem>;
const sortable = (key: SortKey, label: string, p: Pick<Props, "sort" | "dir" | "onSort">, cell: Cell["cell"], more: Partial<Cell> = {}): Cell => ({
  key,
  header: label,
  head: <SortHeader key={key} label={label} k={key} sort={p.sort} dir={p.dir} onSort={p.onSort} align={more.align === "right" ? "right" : "left"} />,
  cell,
  ...more,
});

/** The register table: object number first and linked, numbers and dates right-aligned, quiet rules. */
export function ObjectsTable({ items, unit, sort, dir, onSort, showOwner = true, today = studioToday() }: Props) {
  const p = { sort, dir, onSort };
  const columns: Cell[] = [
    sortable(
      "objectNumber",
      "Object number",
      p,
      (o) => (
        <Link to={`/objects/${o.id}`} className="text-accent hover:underline">
          {o.objectNumber}
        </Link>
      ),
      { td: "whitespace-nowrap font-semibold num" },
    ),
    sortable("title", "Title", p, (o) => o.title, { td: "min-w-48" }),
    sortable("maker", "Maker", p, (o) => o.maker ?? "—", { td: "text-ink-soft" }),
    // The type gives way first on narrower screens: the mount columns say more about the work in hand.
    {
      key: "type",
      header: "Type",
      th: "hidden 2xl:table-cell",
      td: "hidden text-ink-soft 2xl:table-cell",
      cell: (o) => OBJECT_TYPE_LABELS[o.objectType as ObjectType] ?? o.objectType,
    },
    { key: "sheet", header: "Sheet", align: "right", td: "whitespace-nowrap num", cell: (o) => sheetSize(o.sheetWidthMm, o.sheetHeightMm, unit) },
    ...(showOwner ? [{ key: "owner", header: "Owner", td: "text-ink-soft", cell: (o: ObjectListItem) => o.clientName }] : []),
    sortable("status", "Status", p, (o) => (
      <>
        <StatusBadge status={o.status as ObjectStatus} />
        {o.location && <span className="mt-0.5 block text-xs text-graphite">{o.location}</span>}
      </>
    )),
    { key: "mount", header: "Current mount", th: "whitespace-nowrap", td: "min-w-44", cell: (o) => <CurrentMount o={o} /> },
    sortable("lastMountedOn", "Last mounted", p, (o) => (o.lastMountedOn ? formatDate(o.lastMountedOn) : <span className="text-graphite">—</span>), {
      align: "right",
      td: "whitespace-nowrap num",
    }),
    sortable("checkDueOn", "Check due", p, (o) => <CheckDue on={o.checkDueOn} today={today} />, { align: "right", td: "whitespace-nowrap num" }),
  ];
  return <DataTable columns={columns} rows={items} rowKey={(o) => o.id} />;
}

import { Link } from "react-router";
import type { ObjectListItem, ObjectStatus, ObjectType } from "@shared/schemas/objects.ts";
import { OBJECT_TYPE_LABELS } from "@shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "@shared/schemas/mountings.ts";
import type { Unit } from "@shared/domain/units.ts";
import { formatDate, sheetSize } from "@/lib/format.ts";
import { studioToday } from "@/lib/today.ts";
import { StatusBadge } from "./status-badge.tsx";

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

function SortHeader({
  label,
  k,
  sort,
  dir,
  onSort,
  align = "left",
}: { label: string; k: SortKey; align?: "left" | "right" } & Pick<Props, "sort" | "dir" | "onSort">) {
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

/** The register table: object number first and linked, numbers and dates right-aligned, quiet rules. */
export function ObjectsTable({ items, unit, sort, dir, onSort, showOwner = true, today = studioToday() }: Props) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <thead className="sticky top-0 z-10 bg-paper-sheet text-ink-soft shadow-[0_1px_0_var(--color-stone)]">
          <tr>
            <SortHeader label="Object number" k="objectNumber" sort={sort} dir={dir} onSort={onSort} />
            <SortHeader label="Title" k="title" sort={sort} dir={dir} onSort={onSort} />
            <SortHeader label="Maker" k="maker" sort={sort} dir={dir} onSort={onSort} />
            {/* The type gives way first on narrower screens: the mount columns say more about the work in hand. */}
            <th scope="col" className="hidden px-3 py-2.5 text-left font-semibold 2xl:table-cell">Type</th>
            <th scope="col" className="px-3 py-2.5 text-right font-semibold">Sheet</th>
            {showOwner && <th scope="col" className="px-3 py-2.5 text-left font-semibold">Owner</th>}
            <SortHeader label="Status" k="status" sort={sort} dir={dir} onSort={onSort} />
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Current mount</th>
            <SortHeader label="Last mounted" k="lastMountedOn" sort={sort} dir={dir} onSort={onSort} align="right" />
            <SortHeader label="Check due" k="checkDueOn" sort={sort} dir={dir} onSort={onSort} align="right" />
          </tr>
        </thead>
        <tbody>
          {items.map((o) => (
            <tr key={o.id} className="border-b border-stone-light hover:bg-paper-deep/60">
              <td className="whitespace-nowrap px-3 py-3 font-semibold num">
                <Link to={`/objects/${o.id}`} className="text-accent hover:underline">
                  {o.objectNumber}
                </Link>
              </td>
              <td className="min-w-48 px-3 py-3">{o.title}</td>
              <td className="px-3 py-3 text-ink-soft">{o.maker ?? "—"}</td>
              <td className="hidden px-3 py-3 text-ink-soft 2xl:table-cell">{OBJECT_TYPE_LABELS[o.objectType as ObjectType] ?? o.objectType}</td>
              <td className="whitespace-nowrap px-3 py-3 text-right num">{sheetSize(o.sheetWidthMm, o.sheetHeightMm, unit)}</td>
              {showOwner && <td className="px-3 py-3 text-ink-soft">{o.clientName}</td>}
              <td className="px-3 py-3">
                <StatusBadge status={o.status as ObjectStatus} />
                {o.location && <span className="mt-0.5 block text-xs text-graphite">{o.location}</span>}
              </td>
              <td className="min-w-44 px-3 py-3">
                <CurrentMount o={o} />
              </td>
              <td className="whitespace-nowrap px-3 py-3 text-right num">{o.lastMountedOn ? formatDate(o.lastMountedOn) : <span className="text-graphite">—</span>}</td>
              <td className="whitespace-nowrap px-3 py-3 text-right num">
                <CheckDue on={o.checkDueOn} today={today} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

import { Link } from "react-router";
import type { ObjectListItem, ObjectStatus, ObjectType } from "@shared/schemas/objects.ts";
import { OBJECT_TYPE_LABELS } from "@shared/schemas/objects.ts";
import type { Unit } from "@shared/domain/units.ts";
import { sheetSize } from "@/lib/format.ts";
import { StatusBadge } from "./status-badge.tsx";

export type SortKey = "objectNumber" | "title" | "maker" | "status" | "updatedAt";
type Props = {
  items: ObjectListItem[];
  unit: Unit;
  sort?: SortKey;
  dir?: "asc" | "desc";
  onSort?: (key: SortKey) => void;
  showOwner?: boolean;
};

function SortHeader({ label, k, sort, dir, onSort, className = "" }: { label: string; k: SortKey } & Pick<Props, "sort" | "dir" | "onSort"> & { className?: string }) {
  const active = sort === k;
  const ariaSort = active ? (dir === "desc" ? "descending" : "ascending") : "none";
  return (
    <th scope="col" aria-sort={onSort ? ariaSort : undefined} className={`whitespace-nowrap px-3 py-2.5 text-left font-semibold ${className}`}>
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

/** The register table: object number first and linked, numbers right-aligned, quiet rules. */
export function ObjectsTable({ items, unit, sort, dir, onSort, showOwner = true }: Props) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <thead className="sticky top-0 z-10 bg-paper-sheet text-ink-soft shadow-[0_1px_0_var(--color-stone)]">
          <tr>
            <SortHeader label="Object number" k="objectNumber" sort={sort} dir={dir} onSort={onSort} />
            <SortHeader label="Title" k="title" sort={sort} dir={dir} onSort={onSort} />
            <SortHeader label="Maker" k="maker" sort={sort} dir={dir} onSort={onSort} />
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Type</th>
            <th scope="col" className="px-3 py-2.5 text-right font-semibold">Sheet</th>
            {showOwner && <th scope="col" className="px-3 py-2.5 text-left font-semibold">Owner</th>}
            <SortHeader label="Status" k="status" sort={sort} dir={dir} onSort={onSort} />
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
              <td className="px-3 py-3">{o.title}</td>
              <td className="px-3 py-3 text-ink-soft">{o.maker ?? "—"}</td>
              <td className="px-3 py-3 text-ink-soft">{OBJECT_TYPE_LABELS[o.objectType as ObjectType] ?? o.objectType}</td>
              <td className="whitespace-nowrap px-3 py-3 text-right num">{sheetSize(o.sheetWidthMm, o.sheetHeightMm, unit)}</td>
              {showOwner && <td className="px-3 py-3 text-ink-soft">{o.clientName}</td>}
              <td className="px-3 py-3">
                <StatusBadge status={o.status as ObjectStatus} />
                {o.location && <span className="mt-0.5 block text-xs text-graphite">{o.location}</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

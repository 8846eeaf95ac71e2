import type { ReactNode } from "react";
import { Link } from "react-router";
import { CUSTODY_KIND_LABELS, type CustodyKind, type CustodyReceipt } from "@shared/schemas/custody.ts";
import { Badge, EmptyState, ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { DataTable, type Column } from "@/components/ui/data-table.tsx";
import { formatDate } from "@/lib/format.ts";
import { useObjectCustody } from "../api/custody.ts";

const kindLabel = (kind: string) => CUSTODY_KIND_LABELS[kind as CustodyKind] ?? kind;

/** In or out, as a word and an arrow as well as a tone. */
export function DirectionBadge({ direction }: { direction: "in" | "out" }) {
  return direction === "in" ? (
    <Badge tone="accent">
      <span aria-hidden="true">↓ </span>In
    </Badge>
  ) : (
    <Badge>
      <span aria-hidden="true">↑ </span>Out
    </Badge>
  );
}

/** One object's receipts, newest first, as a compact register: date and hand-over, who to whom, condition, signature. */
export function CustodyList({ objectId, actions }: { objectId: string; actions?: (r: CustodyReceipt) => ReactNode }) {
  const q = useObjectCustody(objectId);
  if (q.isPending) return <SkeletonRows rows={3} />;
  if (q.isError) return <ErrorNotice title="The receipts could not be loaded" error={q.error} />;
  if (q.data.length === 0)
    return (
      <EmptyState title="No receipts yet">
        Each time this object comes into the studio or leaves it, a receipt records the date, who handed it over and who took it, its condition in one line, and who signed.
      </EmptyState>
    );
  return (
    <ol aria-label="Custody receipts, newest first" className="divide-y divide-stone-light">
      {q.data.map((r) => (
        <ReceiptLine key={r.id} r={r} actions={actions?.(r)} />
      ))}
    </ol>
  );
}

function ReceiptLine({ r, actions }: { r: CustodyReceipt; actions?: ReactNode }) {
  return (
    <li className="grid gap-x-4 gap-y-0.5 py-3 text-sm sm:grid-cols-[7rem_1fr]">
      <div className="flex items-center gap-2 sm:block">
        <p className="font-medium num">{formatDate(r.date)}</p>
        <div className="sm:mt-1">
          <DirectionBadge direction={r.direction} />
        </div>
      </div>
      <div className="min-w-0">
        <p className="font-medium">{kindLabel(r.kind)}</p>
        <p className="text-ink-soft">
          From {r.fromParty} to {r.toParty}
        </p>
        <p>
          <span className="text-graphite">Condition {r.direction === "in" ? "on arrival" : "on departure"}:</span> {r.condition}
        </p>
        <p className="text-graphite">Signed by {r.signedBy}</p>
        {r.notes && <p className="mt-0.5 whitespace-pre-line text-graphite">{r.notes}</p>}
        {actions && <div className="mt-1">{actions}</div>}
      </div>
    </li>
  );
}

const RECEIPT_COLUMNS: Column<CustodyReceipt>[] = [
  {
    key: "number",
    header: "Object number",
    th: "whitespace-nowrap",
    cell: (r) => (
      <>
        <Link to={`/objects/${r.objectId}`} className="whitespace-nowrap font-semibold text-accent num hover:underline">
          {r.objectNumber}
        </Link>
        <span className="mt-0.5 block text-xs text-graphite">{r.objectTitle}</span>
      </>
    ),
  },
  { key: "date", header: "Date", th: "whitespace-nowrap", td: "whitespace-nowrap num", cell: (r) => formatDate(r.date) },
  {
    key: "kind",
    header: "Hand-over",
    cell: (r) => (
      <span className="flex items-center gap-2 whitespace-nowrap">
        <DirectionBadge direction={r.direction} />
        <span className="text-ink-soft">{kindLabel(r.kind)}</span>
      </span>
    ),
  },
  {
    key: "parties",
    header: "From → to",
    td: "min-w-48 text-ink-soft",
    cell: (r) => (
      <>
        {r.fromParty} <span aria-hidden="true">→</span>
        <span className="sr-only">to</span> {r.toParty}
      </>
    ),
  },
  { key: "condition", header: "Condition", td: "min-w-56", cell: (r) => r.condition },
  { key: "signed", header: "Signed by", th: "whitespace-nowrap", td: "text-ink-soft", cell: (r) => r.signedBy },
];

/** Receipts across objects (the studio-wide register of hand-overs), object number first and linked. */
export function ReceiptsTable({ items }: { items: CustodyReceipt[] }) {
  return <DataTable columns={RECEIPT_COLUMNS} rows={items} rowKey={(r) => r.id} rowClassName="border-b border-stone-light align-top hover:bg-paper-deep/60" />;
}

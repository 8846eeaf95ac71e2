import type { ReactNode } from "react";
import { Link } from "react-router";
import { CUSTODY_KIND_LABELS, type CustodyKind, type CustodyReceipt } from "@shared/schemas/custody.ts";
import { Badge, EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
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
  if (q.isError)
    return (
      <Notice tone="fail" title="The receipts could not be loaded">
        {q.error.message}
      </Notice>
    );
  if (q.data.length === 0)
    return (
      <EmptyState title="No receipts yet">
        Each time this object comes into the studio or leaves it, a receipt records the date, who handed it over and who took it, its condition in one line, and
        who signed.
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

/** Receipts across objects (the studio-wide register of hand-overs), object number first and linked. */
export function ReceiptsTable({ items }: { items: CustodyReceipt[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <thead className="sticky top-0 z-10 bg-paper-sheet text-ink-soft shadow-[0_1px_0_var(--color-stone)]">
          <tr>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Object number</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Date</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Hand-over</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">From → to</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Condition</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Signed by</th>
          </tr>
        </thead>
        <tbody>
          {items.map((r) => (
            <tr key={r.id} className="border-b border-stone-light align-top hover:bg-paper-deep/60">
              <td className="px-3 py-3">
                <Link to={`/objects/${r.objectId}`} className="whitespace-nowrap font-semibold text-accent num hover:underline">
                  {r.objectNumber}
                </Link>
                <span className="mt-0.5 block text-xs text-graphite">{r.objectTitle}</span>
              </td>
              <td className="whitespace-nowrap px-3 py-3 num">{formatDate(r.date)}</td>
              <td className="px-3 py-3">
                <span className="flex items-center gap-2 whitespace-nowrap">
                  <DirectionBadge direction={r.direction} />
                  <span className="text-ink-soft">{kindLabel(r.kind)}</span>
                </span>
              </td>
              <td className="min-w-48 px-3 py-3 text-ink-soft">
                {r.fromParty} <span aria-hidden="true">→</span>
                <span className="sr-only">to</span> {r.toParty}
              </td>
              <td className="min-w-56 px-3 py-3">{r.condition}</td>
              <td className="px-3 py-3 text-ink-soft">{r.signedBy}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

import { Link, Navigate, useSearchParams } from "react-router";
import { CUSTODY_KINDS, CUSTODY_KIND_LABELS, type CustodyKind } from "@shared/schemas/custody.ts";
import { isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useCustodyReceipts, useInStudio, type InStudioItem } from "@/features/custody/api/custody.ts";
import { ReceiptsTable } from "@/features/custody/components/custody-list.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { FilterSelect } from "@/components/ui/field.tsx";
import { Card, EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";

const IN_STUDIO_PAGE = 50;
const RECEIPTS_PAGE = 25;
const DATE_INPUT =
  "rounded-card border border-stone bg-paper-sheet px-3 py-2 text-sm text-ink num focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30";

function InStudioTable({ items }: { items: InStudioItem[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <thead className="sticky top-0 z-10 bg-paper-sheet text-ink-soft shadow-[0_1px_0_var(--color-stone)]">
          <tr>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Object number</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Title</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Owner</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-left font-semibold">Received on</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">From</th>
            <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-right font-semibold">Days in studio</th>
            <th scope="col" className="px-3 py-2.5 text-left font-semibold">Condition on arrival</th>
          </tr>
        </thead>
        <tbody>
          {items.map((o) => (
            <tr key={o.objectId} className="border-b border-stone-light align-top hover:bg-paper-deep/60">
              <td className="whitespace-nowrap px-3 py-3 font-semibold num">
                <Link to={`/objects/${o.objectId}`} className="text-accent hover:underline">
                  {o.objectNumber}
                </Link>
              </td>
              <td className="px-3 py-3">
                {o.title}
                {o.location && <span className="mt-0.5 block text-xs text-graphite">{o.location}</span>}
              </td>
              <td className="px-3 py-3 text-ink-soft">{o.clientName}</td>
              <td className="whitespace-nowrap px-3 py-3 num">
                {o.receipt ? formatDate(o.receipt.date) : <span className="text-graphite">Recorded {formatDate(o.since)}</span>}
              </td>
              <td className="px-3 py-3 text-ink-soft">{o.receipt?.fromParty ?? "—"}</td>
              <td className="whitespace-nowrap px-3 py-3 text-right num">{o.daysInStudio.toLocaleString("en-GB")}</td>
              <td className="min-w-56 px-3 py-3">
                {o.receipt ? o.receipt.condition : <span className="text-graphite">No receipt written: record one from the object's page.</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Custody: what is in the studio now, and every receipt in and out. Studio staff only. */
export function Component() {
  const { data: user } = useMe();
  const [params, setParams] = useSearchParams();
  const studio = !!user && isStudio(user);

  const page = Math.max(1, Number(params.get("page") ?? 1) || 1);
  const rpage = Math.max(1, Number(params.get("rpage") ?? 1) || 1);
  const direction = (params.get("direction") as "in" | "out" | null) || undefined;
  const kind = (params.get("kind") as CustodyKind | null) || undefined;
  const from = params.get("from") || undefined;
  const to = params.get("to") || undefined;
  const filtered = !!(direction || kind || from || to);

  const update = (changes: Record<string, string | undefined>, resetPage: string | null = "rpage") => {
    setParams(
      (prev) => {
        const n = new URLSearchParams(prev);
        for (const [k, v] of Object.entries(changes)) v ? n.set(k, v) : n.delete(k);
        if (resetPage) n.delete(resetPage);
        return n;
      },
      { replace: true },
    );
  };

  const inStudio = useInStudio({ page, pageSize: IN_STUDIO_PAGE });
  const receipts = useCustodyReceipts({ direction, kind, from, to, page: rpage, pageSize: RECEIPTS_PAGE });
  if (user && !studio) return <Navigate to="/objects" replace />;

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Custody</h1>
          <p className="text-sm text-graphite">What the studio holds now, and every receipt written as objects come in and go out.</p>
        </div>
        <ButtonLink to="/objects" variant="secondary">
          Open the register
        </ButtonLink>
      </header>

      <Card title={`In the studio now${inStudio.data ? ` · ${inStudio.data.total.toLocaleString("en-GB")}` : ""}`}>
        <div aria-busy={inStudio.isFetching}>
          {inStudio.isPending ? (
            <SkeletonRows rows={5} />
          ) : inStudio.isError ? (
            <Notice tone="fail" title="The list could not be loaded">
              {inStudio.error.message}
            </Notice>
          ) : inStudio.data.items.length === 0 ? (
            <EmptyState title="Nothing in the studio" action={<ButtonLink to="/objects">Find the object in the register</ButtonLink>}>
              Every object the studio holds is listed here, the longest-held first, with who brought it in and its condition on arrival. When a work comes in,
              open it in the register and record its receipt.
            </EmptyState>
          ) : (
            <div className="-mx-5 -my-4">
              <InStudioTable items={inStudio.data.items} />
              <Pagination page={page} pageSize={IN_STUDIO_PAGE} total={inStudio.data.total} onPage={(p) => update({ page: String(p) }, null)} />
            </div>
          )}
        </div>
      </Card>

      <Card title="Recent receipts">
        <div className="space-y-4" aria-busy={receipts.isFetching}>
          <div role="group" aria-label="Filter receipts" className="flex flex-wrap items-end gap-3">
            <FilterSelect aria-label="In or out" value={direction ?? ""} onChange={(e) => update({ direction: e.target.value || undefined })}>
              <option value="">In and out</option>
              <option value="in">In</option>
              <option value="out">Out</option>
            </FilterSelect>
            <FilterSelect aria-label="Kind of hand-over" value={kind ?? ""} onChange={(e) => update({ kind: e.target.value || undefined })}>
              <option value="">Any hand-over</option>
              {CUSTODY_KINDS.map((k) => (
                <option key={k} value={k}>
                  {CUSTODY_KIND_LABELS[k]}
                </option>
              ))}
            </FilterSelect>
            <label className="flex items-center gap-2 text-sm text-ink-soft">
              From
              <input type="date" className={DATE_INPUT} value={from ?? ""} onChange={(e) => update({ from: e.target.value || undefined })} />
            </label>
            <label className="flex items-center gap-2 text-sm text-ink-soft">
              to
              <input type="date" className={DATE_INPUT} value={to ?? ""} onChange={(e) => update({ to: e.target.value || undefined })} />
            </label>
            {filtered && (
              <button
                type="button"
                className="py-2 text-sm font-medium text-accent hover:underline"
                onClick={() => update({ direction: undefined, kind: undefined, from: undefined, to: undefined })}
              >
                Clear filters
              </button>
            )}
          </div>
          {receipts.isPending ? (
            <SkeletonRows rows={5} />
          ) : receipts.isError ? (
            <Notice tone="fail" title="The receipts could not be loaded">
              {receipts.error.message}
            </Notice>
          ) : receipts.data.items.length === 0 ? (
            filtered ? (
              <EmptyState title="No receipt matches">Widen the dates, or clear the filters.</EmptyState>
            ) : (
              <EmptyState title="No receipts yet">
                Every hand-over into or out of the studio is listed here, newest first: intakes and returns to owners, loans, and visits to conservators. Receipts
                are written from each object's page.
              </EmptyState>
            )
          ) : (
            <div className="-mx-5 -mb-4">
              <ReceiptsTable items={receipts.data.items} />
              <Pagination page={rpage} pageSize={RECEIPTS_PAGE} total={receipts.data.total} onPage={(p) => update({ rpage: String(p) }, null)} />
            </div>
          )}
        </div>
      </Card>
    </div>
  );
}

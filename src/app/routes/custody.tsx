import { Navigate } from "react-router";
import { CUSTODY_KINDS, CUSTODY_KIND_LABELS, CustodyPageSearchSchema } from "@shared/schemas/custody.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useCustodyReceipts, useInStudio, type InStudioItem } from "@/features/custody/api/custody.ts";
import { ReceiptsTable } from "@/features/custody/components/custody-list.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { ClearFilters, DateFilter, EnumFilter } from "@/components/ui/filters.tsx";
import { DataTable, objectNumberColumn, type Column } from "@/components/ui/data-table.tsx";
import { noItems, PageHeader, QueryView } from "@/components/ui/list-page.tsx";
import { Card, EmptyState } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";
import { useSearchState } from "@/lib/use-search-state.ts";

const IN_STUDIO_PAGE = 50;
const RECEIPTS_PAGE = 25;
/** Two lists on one page: the in-studio list's page, and the receipts' filter and page (`rpage`). */
const SearchSchema = CustodyPageSearchSchema;
const DIRECTIONS = ["in", "out"] as const;
const DIRECTION_LABELS = { in: "In", out: "Out" };

const IN_STUDIO_COLUMNS: Column<InStudioItem>[] = [
  objectNumberColumn(),
  {
    key: "title",
    header: "Title",
    cell: (o) => (
      <>
        {o.title}
        {o.location && <span className="mt-0.5 block text-xs text-graphite">{o.location}</span>}
      </>
    ),
  },
  { key: "owner", header: "Owner", td: "text-ink-soft", cell: (o) => o.clientName },
  {
    key: "received",
    header: "Received on",
    th: "whitespace-nowrap",
    td: "whitespace-nowrap num",
    cell: (o) => (o.receipt ? formatDate(o.receipt.date) : <span className="text-graphite">Recorded {formatDate(o.since)}</span>),
  },
  { key: "from", header: "From", td: "text-ink-soft", cell: (o) => o.receipt?.fromParty ?? "—" },
  { key: "days", header: "Days in studio", align: "right", th: "whitespace-nowrap", td: "whitespace-nowrap num", cell: (o) => o.daysInStudio.toLocaleString("en-GB") },
  {
    key: "condition",
    header: "Condition on arrival",
    td: "min-w-56",
    cell: (o) => (o.receipt ? o.receipt.condition : <span className="text-graphite">No receipt written: record one from the object's page.</span>),
  },
];

/** Custody: what is in the studio now, and every receipt in and out. Studio staff only. */
export function Component() {
  const { data: user } = useMe();
  const studio = can(user, "custody:list");
  const { state, set: update } = useSearchState(SearchSchema, { resetPage: "rpage" });
  const { page, rpage, direction, kind, from, to } = state;
  const filtered = !!(direction || kind || from || to);

  const inStudio = useInStudio({ page, pageSize: IN_STUDIO_PAGE });
  const receipts = useCustodyReceipts({ direction, kind, from, to, page: rpage, pageSize: RECEIPTS_PAGE });
  if (user && !studio) return <Navigate to="/objects" replace />;

  return (
    <div className="space-y-6">
      <PageHeader
        title="Custody"
        intro="What the studio holds now, and every receipt written as objects come in and go out."
        actions={
          <ButtonLink to="/objects" variant="secondary">
            Open the register
          </ButtonLink>
        }
      />

      <Card title={`In the studio now${inStudio.data ? ` · ${inStudio.data.total.toLocaleString("en-GB")}` : ""}`}>
        <div aria-busy={inStudio.isFetching}>
          <QueryView
            query={inStudio}
            rows={5}
            errorTitle="The list could not be loaded"
            isEmpty={noItems}
            empty={
              <EmptyState title="Nothing in the studio" action={<ButtonLink to="/objects">Find the object in the register</ButtonLink>}>
                Every object the studio holds is listed here, the longest-held first, with who brought it in and its condition on arrival. When a work comes in, open it in the
                register and record its receipt.
              </EmptyState>
            }
          >
            {(data) => (
              <div className="-mx-5 -my-4">
                <DataTable columns={IN_STUDIO_COLUMNS} rows={data.items} rowKey={(o) => o.objectId} rowClassName="border-b border-stone-light align-top hover:bg-paper-deep/60" />
                <Pagination page={page} pageSize={IN_STUDIO_PAGE} total={data.total} onPage={(p) => update({ page: p }, null)} />
              </div>
            )}
          </QueryView>
        </div>
      </Card>

      <Card title="Recent receipts">
        <div className="space-y-4" aria-busy={receipts.isFetching}>
          <fieldset aria-label="Filter receipts" className="flex flex-wrap items-end gap-3">
            <EnumFilter label="In or out" any="In and out" values={DIRECTIONS} labels={DIRECTION_LABELS} value={direction} onChange={(v) => update({ direction: v })} />
            <EnumFilter label="Kind of hand-over" any="Any hand-over" values={CUSTODY_KINDS} labels={CUSTODY_KIND_LABELS} value={kind} onChange={(v) => update({ kind: v })} />
            <DateFilter
              label="From"
              wrapClassName="flex items-center gap-2 text-sm text-ink-soft"
              inputClassName={DateFilter.roomy}
              value={from}
              onChange={(v) => update({ from: v })}
            />
            <DateFilter label="to" wrapClassName="flex items-center gap-2 text-sm text-ink-soft" inputClassName={DateFilter.roomy} value={to} onChange={(v) => update({ to: v })} />
            <ClearFilters shown={filtered} className="py-2" onClear={() => update({ direction: undefined, kind: undefined, from: undefined, to: undefined })} />
          </fieldset>
          <QueryView
            query={receipts}
            rows={5}
            errorTitle="The receipts could not be loaded"
            isEmpty={noItems}
            empty={
              filtered ? (
                <EmptyState title="No receipt matches">Widen the dates, or clear the filters.</EmptyState>
              ) : (
                <EmptyState title="No receipts yet">
                  Every hand-over into or out of the studio is listed here, newest first: intakes and returns to owners, loans, and visits to conservators. Receipts are written
                  from each object's page.
                </EmptyState>
              )
            }
          >
            {(data) => (
              <div className="-mx-5 -mb-4">
                <ReceiptsTable items={data.items} />
                <Pagination page={rpage} pageSize={RECEIPTS_PAGE} total={data.total} onPage={(p) => update({ rpage: p }, null)} />
              </div>
            )}
          </QueryView>
        </div>
      </Card>
    </div>
  );
}

import { Link } from "react-router";
import { z } from "zod";
import { CONDITION_CONTEXTS, CONDITION_CONTEXT_LABELS, ConditionListQuerySchema, RATINGS, RATING_LABELS } from "@shared/schemas/condition.ts";
import { useConditionRegister, type ConditionRegisterItem } from "@/features/condition/api/condition.ts";
import { RatingBadge } from "@/features/condition/components/report-view.tsx";
import { DateFilter, EnumFilter, RecordFilter } from "@/components/ui/filters.tsx";
import { DataTable, objectNumberColumn, type Column } from "@/components/ui/data-table.tsx";
import { ListSection, noItems } from "@/components/ui/list-page.tsx";
import { EmptyState } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";
import { studioToday } from "@/lib/today.ts";
import { useSearchState } from "@/lib/use-search-state.ts";

const PAGE_SIZE = 50;
/** The register's address: the shared list query, with "unresolved" and "check due" as switches. */
const SearchSchema = ConditionListQuerySchema.pick({ rating: true, context: true, from: true, to: true, examinerId: true, page: true }).extend({
  unresolved: z.literal("true").optional(),
  due: z.literal("1").optional(),
});
const DATE_INPUT = "rounded-card border border-stone bg-paper-sheet px-2 py-1.5";

const link = "text-accent hover:underline";
const COLUMNS: Column<ConditionRegisterItem>[] = [
  {
    key: "date",
    header: "Date",
    th: "whitespace-nowrap",
    td: "whitespace-nowrap num",
    cell: (r) => (
      <Link className={link} to={`/condition/${r.id}`}>
        {formatDate(r.reportDate)}
      </Link>
    ),
  },
  objectNumberColumn(),
  { key: "title", header: "Title", th: "whitespace-nowrap", cell: (r) => r.objectTitle },
  { key: "context", header: "Context", th: "whitespace-nowrap", td: "text-ink-soft", cell: (r) => CONDITION_CONTEXT_LABELS[r.context] },
  { key: "rating", header: "Rating", th: "whitespace-nowrap", cell: (r) => <RatingBadge rating={r.rating} /> },
  { key: "unresolved", header: "Unresolved", align: "right", th: "whitespace-nowrap", td: "num", cell: (r) => r.unresolvedCount },
  { key: "examiner", header: "Examiner", th: "whitespace-nowrap", td: "text-ink-soft", cell: (r) => r.examinerName },
  { key: "due", header: "Check due", th: "whitespace-nowrap", td: "whitespace-nowrap num", cell: (r) => formatDate(r.checkDueOn) },
  { key: "status", header: "Status", th: "whitespace-nowrap", td: "text-ink-soft", cell: (r) => (r.status === "signed" ? "Signed" : "Draft") },
];

/** Condition: every report across objects, with what is unresolved and what is due. */
export function Component() {
  const { state, set } = useSearchState(SearchSchema, { names: { examinerId: "examiner" } });
  const { rating, context, from, to, examinerId, unresolved, due, page } = state;
  const q = useConditionRegister({ rating, context, from, to, examinerId, unresolved, dueBy: due ? studioToday() : undefined, page, pageSize: PAGE_SIZE });

  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-2xl font-bold tracking-tight">Condition</h1>
        <p className="text-sm text-graphite">Every condition report, newest first. Findings are observations, not treatment: refer treatment to a qualified conservator.</p>
      </header>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <EnumFilter label="Rating" any="Any rating" values={RATINGS} labels={RATING_LABELS} value={rating} onChange={(v) => set({ rating: v })} />
        <EnumFilter label="Context" any="Any context" values={CONDITION_CONTEXTS} labels={CONDITION_CONTEXT_LABELS} value={context} onChange={(v) => set({ context: v })} />
        <RecordFilter label="Examiner" any="Any examiner" items={q.data?.examiners} value={examinerId} onChange={(v) => set({ examinerId: v })} />
        <DateFilter label="From " ariaLabel="From" wrapClassName="flex items-center gap-1" inputClassName={DATE_INPUT} value={from} onChange={(v) => set({ from: v })} />
        <DateFilter label="to " ariaLabel="To" wrapClassName="flex items-center gap-1" inputClassName={DATE_INPUT} value={to} onChange={(v) => set({ to: v })} />
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={unresolved === "true"} onChange={(e) => set({ unresolved: e.target.checked ? "true" : undefined })} /> Unresolved findings
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={!!due} onChange={(e) => set({ due: e.target.checked ? "1" : undefined })} /> Check due
        </label>
      </div>
      <ListSection
        label="Condition reports"
        query={q}
        isEmpty={noItems}
        empty={
          <EmptyState title="No condition reports match">Reports are written from an object's page, on arrival, before and after mounting, and at every hand-over.</EmptyState>
        }
      >
        {(data) => (
          <>
            <DataTable columns={COLUMNS} rows={data.items} rowKey={(r) => r.id} head="plain" tableClassName="w-full text-sm" />
            <Pagination page={page} pageSize={PAGE_SIZE} total={data.total} onPage={(p) => set({ page: p }, null)} />
          </>
        )}
      </ListSection>
    </div>
  );
}

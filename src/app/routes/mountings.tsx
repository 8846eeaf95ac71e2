import { ATTACHMENT_METHODS } from "@shared/schemas/mount-plan.ts";
import {
  ATTACHMENT_METHOD_LABELS,
  BOARD_GRADE_LABELS,
  GLAZING_TYPE_LABELS,
  MOUNTING_REASON_LABELS,
  MOUNTING_STATUSES,
  MOUNTING_STATUS_LABELS,
  MountingListQuerySchema,
  type MountingListItem,
  type MountingStatus,
} from "@shared/schemas/mountings.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useMountingsRegister } from "@/features/mountings-register/api/mountings-register.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { SearchInput } from "@/components/ui/field.tsx";
import { ClearFilters, DateFilter, EnumFilter, RecordFilter } from "@/components/ui/filters.tsx";
import { DataTable, objectNumberColumn, type Column } from "@/components/ui/data-table.tsx";
import { ListSection, noItems, PageHeader } from "@/components/ui/list-page.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Badge, EmptyState, Notice } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";
import { useSearchState, useSearchText } from "@/lib/use-search-state.ts";

const PAGE_SIZE = 50;
const label = (labels: Record<string, string>, v: string | null) => (v ? (labels[v] ?? v) : "—");
const SearchSchema = MountingListQuerySchema.omit({ pageSize: true });

function MountingStatusBadge({ status }: { status: MountingStatus }) {
  return <Badge tone={status === "completed" ? "accent" : status === "draft" ? "warn" : "neutral"}>{MOUNTING_STATUS_LABELS[status]}</Badge>;
}

/** The batches of the record's current revision; a batch found only in an earlier revision is said so. */
function Batches({ m, searched }: { m: MountingListItem; searched?: string }) {
  const earlier = !!searched && !m.batches.some((b) => b.toLowerCase() === searched.toLowerCase());
  return (
    <>
      {m.batches.length === 0 ? (
        <span className="text-graphite">—</span>
      ) : (
        m.batches.map((b) => (
          <span key={b} className="block num">
            {b}
          </span>
        ))
      )}
      {earlier && <span className="mt-0.5 block text-xs text-graphite">{searched} in an earlier revision</span>}
    </>
  );
}

const columns = (batch: string | undefined): Column<MountingListItem>[] => [
  { key: "mounted", header: "Mounted", align: "right", th: "whitespace-nowrap", td: "whitespace-nowrap num", cell: (m) => formatDate(m.mountedOn) },
  objectNumberColumn(),
  { key: "title", header: "Title", cell: (m) => m.objectTitle },
  { key: "framer", header: "Framer", td: "text-ink-soft", cell: (m) => m.framerName },
  { key: "reason", header: "Reason", td: "text-ink-soft", cell: (m) => label(MOUNTING_REASON_LABELS, m.reason) },
  { key: "method", header: "Method", cell: (m) => label(ATTACHMENT_METHOD_LABELS, m.method) },
  { key: "boards", header: "Boards", td: "text-ink-soft", cell: (m) => label(BOARD_GRADE_LABELS, m.boardGrade) },
  { key: "glazing", header: "Glazing", td: "text-ink-soft", cell: (m) => label(GLAZING_TYPE_LABELS, m.glazing) },
  { key: "batches", header: "Batches", td: "whitespace-nowrap", cell: (m) => <Batches m={m} searched={batch} /> },
  { key: "status", header: "Status", cell: (m) => <MountingStatusBadge status={m.status} /> },
];

/** The mountings register: every mounting record across objects, to answer "which objects used board from batch X?". */
export function Component() {
  const { data: user } = useMe();
  const allowed = can(user, "mounting:list");
  const { state, set: update } = useSearchState(SearchSchema, { names: { framerId: "framer" } });
  const { framerId, from, to, method, status, page } = state;
  const search = useSearchText(state.batch, (batch) => update({ batch }));
  const batch = search.debounced;

  const list = useMountingsRegister({ framerId, from, to, method, status, batch: batch || undefined, page, pageSize: PAGE_SIZE }, allowed);
  const otherFilters = !!(framerId || from || to || method || status);
  const filtered = otherFilters || !!batch;
  const backwards = !!from && !!to && from > to;

  if (user && !allowed) {
    return (
      <div className="space-y-5">
        <h1 className="text-2xl font-bold tracking-tight">Mountings</h1>
        <Notice title="For studio staff">The mountings register lists the studio's work on every client's objects. Each object's own mountings are on its page.</Notice>
      </div>
    );
  }

  return (
    <div className="space-y-5">
      <PageHeader
        gap="gap-3"
        title="Mountings"
        intro="Every mounting record across objects, newest first. Type a board's batch number to find every object mounted with board from that batch."
        actions={
          list.data &&
          list.data.items.length > 0 && (
            <DocumentButton
              url="/api/documents/workshop-sheet"
              label={`Workshop sheet for these ${list.data.items.length}`}
              body={{ mountingIds: list.data.items.map((m) => m.id) }}
              fallbackName="workshop-sheet.pdf"
            />
          )
        }
      />

      <search aria-label="Filter mountings" className="flex flex-wrap items-center gap-3">
        <label className="sr-only" htmlFor="mountings-batch">
          Board batch
        </label>
        <SearchInput id="mountings-batch" placeholder="Board batch, e.g. MB-2291" value={search.text} onChange={(e) => search.setText(e.target.value)} className="max-w-56" />
        <RecordFilter label="Framer" any="Any framer" items={list.data?.framers} value={framerId} onChange={(v) => update({ framerId: v })} />
        <DateFilter label="Mounted from" value={from} onChange={(v) => update({ from: v })} />
        <DateFilter label="to" value={to} onChange={(v) => update({ to: v })} />
        <EnumFilter label="Method" any="Any method" values={ATTACHMENT_METHODS} labels={ATTACHMENT_METHOD_LABELS} value={method} onChange={(v) => update({ method: v })} />
        <EnumFilter label="Status" any="Any status" values={MOUNTING_STATUSES} labels={MOUNTING_STATUS_LABELS} value={status} onChange={(v) => update({ status: v })} />
        <ClearFilters
          shown={filtered}
          onClear={() => {
            search.setText("");
            update({ batch: undefined, framerId: undefined, from: undefined, to: undefined, method: undefined, status: undefined });
          }}
        />
      </search>

      {backwards && (
        <Notice tone="warn" title="The dates are the wrong way round">
          “Mounted from” ({formatDate(from)}) is after “to” ({formatDate(to)}), so no mounting can fall between them.
        </Notice>
      )}
      {batch && list.data && list.data.total > 0 && (
        <p className="text-sm text-ink-soft" role="status">
          Mounting records with board from batch <span className="font-semibold num">{batch}</span>, in any revision of the record.
        </p>
      )}

      <ListSection
        label="Mountings"
        busy={list.isFetching}
        query={list}
        errorTitle="The mountings register could not be loaded"
        isEmpty={noItems}
        empty={
          batch ? (
            <EmptyState title={`No mounting used board from batch ${batch}`}>
              The batch is matched whole, in capitals or not; check the number on the board's label{otherFilters ? ", or clear the other filters" : ""}.
            </EmptyState>
          ) : filtered ? (
            <EmptyState title="No mounting matches">Widen the dates, or clear the filters.</EmptyState>
          ) : (
            <EmptyState title="No mountings yet" action={<ButtonLink to="/objects">Open the register</ButtonLink>}>
              Every mounting, reframing and correction recorded on an object's page is listed here, with its materials and their batch numbers. Start from an object.
            </EmptyState>
          )
        }
      >
        {(data) => (
          <>
            <DataTable columns={columns(batch || undefined)} rows={data.items} rowKey={(m) => m.id} rowClassName="border-b border-stone-light align-top hover:bg-paper-deep/60" />
            <Pagination page={page} pageSize={PAGE_SIZE} total={data.total} onPage={(p) => update({ page: p }, null)} />
          </>
        )}
      </ListSection>
    </div>
  );
}

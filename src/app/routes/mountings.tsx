import { useEffect, useState } from "react";
import { Link, useSearchParams } from "react-router";
import { ATTACHMENT_METHODS } from "@shared/schemas/mount-plan.ts";
import {
  ATTACHMENT_METHOD_LABELS,
  BOARD_GRADE_LABELS,
  GLAZING_TYPE_LABELS,
  MOUNTING_REASON_LABELS,
  MOUNTING_STATUSES,
  MOUNTING_STATUS_LABELS,
  type MountingListItem,
  type MountingStatus,
} from "@shared/schemas/mountings.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useMountingsRegister } from "@/features/mountings-register/api/mountings-register.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { FilterSelect, SearchInput } from "@/components/ui/field.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Badge, EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";
import { useDebounced } from "@/lib/use-debounced.ts";

const PAGE_SIZE = 50;
const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;
type Method = (typeof ATTACHMENT_METHODS)[number];
const oneOf = <T extends string>(list: readonly T[], v: string | null): T | undefined => (v && (list as readonly string[]).includes(v) ? (v as T) : undefined);
const label = (labels: Record<string, string>, v: string | null) => (v ? (labels[v] ?? v) : "—");

function MountingStatusBadge({ status }: { status: MountingStatus }) {
  return <Badge tone={status === "completed" ? "accent" : status === "draft" ? "warn" : "neutral"}>{MOUNTING_STATUS_LABELS[status]}</Badge>;
}

/** The batches of the record's current revision; a batch found only in an earlier revision is said so. */
function Batches({ m, searched }: { m: MountingListItem; searched?: string }) {
  const earlier = !!searched && !m.batches.some((b) => b.toLowerCase() === searched.toLowerCase());
  return (
    <>
      {m.batches.length === 0 ? <span className="text-graphite">—</span> : m.batches.map((b) => <span key={b} className="block num">{b}</span>)}
      {earlier && <span className="mt-0.5 block text-xs text-graphite">{searched} in an earlier revision</span>}
    </>
  );
}

/** The mountings register: every mounting record across objects, to answer "which objects used board from batch X?". */
export function Component() {
  const { data: user } = useMe();
  const allowed = can(user, "mounting:write");
  const [params, setParams] = useSearchParams();
  const [batchText, setBatchText] = useState(params.get("batch") ?? "");
  const batch = useDebounced(batchText.trim());

  const framerId = params.get("framer") || undefined;
  const from = ISO_DATE.test(params.get("from") ?? "") ? params.get("from")! : undefined;
  const to = ISO_DATE.test(params.get("to") ?? "") ? params.get("to")! : undefined;
  const method = oneOf<Method>(ATTACHMENT_METHODS, params.get("method"));
  const status = oneOf<MountingStatus>(MOUNTING_STATUSES, params.get("status"));
  const page = Math.max(1, Number(params.get("page") ?? 1) || 1);

  const update = (changes: Record<string, string | undefined>, resetPage = true) => {
    setParams(
      (prev) => {
        const n = new URLSearchParams(prev);
        for (const [k, v] of Object.entries(changes)) v ? n.set(k, v) : n.delete(k);
        if (resetPage) n.delete("page");
        return n;
      },
      { replace: true },
    );
  };

  useEffect(() => {
    if ((params.get("batch") ?? "") !== batch) update({ batch: batch || undefined });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [batch]);

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
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Mountings</h1>
          <p className="text-sm text-graphite">
            Every mounting record across objects, newest first. Type a board's batch number to find every object mounted with board from that batch.
          </p>
        </div>
        {list.data && list.data.items.length > 0 && (
          <DocumentButton
            url="/api/documents/workshop-sheet"
            label={`Workshop sheet for these ${list.data.items.length}`}
            body={{ mountingIds: list.data.items.map((m) => m.id) }}
            fallbackName="workshop-sheet.pdf"
          />
        )}
      </header>

      <div role="search" aria-label="Filter mountings" className="flex flex-wrap items-center gap-3">
        <label className="sr-only" htmlFor="mountings-batch">
          Board batch
        </label>
        <SearchInput id="mountings-batch" placeholder="Board batch, e.g. MB-2291" value={batchText} onChange={(e) => setBatchText(e.target.value)} className="max-w-56" />
        <FilterSelect aria-label="Framer" value={framerId ?? ""} onChange={(e) => update({ framer: e.target.value || undefined })}>
          <option value="">Any framer</option>
          {list.data?.framers.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </FilterSelect>
        <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
          Mounted from
          <input
            type="date"
            value={from ?? ""}
            onChange={(e) => update({ from: e.target.value || undefined })}
            className="rounded-card border border-stone bg-paper-sheet px-2 py-1.5 text-sm text-ink num focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30"
          />
        </label>
        <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
          to
          <input
            type="date"
            value={to ?? ""}
            onChange={(e) => update({ to: e.target.value || undefined })}
            className="rounded-card border border-stone bg-paper-sheet px-2 py-1.5 text-sm text-ink num focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30"
          />
        </label>
        <FilterSelect aria-label="Method" value={method ?? ""} onChange={(e) => update({ method: e.target.value || undefined })}>
          <option value="">Any method</option>
          {ATTACHMENT_METHODS.map((m) => (
            <option key={m} value={m}>
              {ATTACHMENT_METHOD_LABELS[m]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect aria-label="Status" value={status ?? ""} onChange={(e) => update({ status: e.target.value || undefined })}>
          <option value="">Any status</option>
          {MOUNTING_STATUSES.map((s) => (
            <option key={s} value={s}>
              {MOUNTING_STATUS_LABELS[s]}
            </option>
          ))}
        </FilterSelect>
        {filtered && (
          <button
            type="button"
            className="text-sm font-medium text-accent hover:underline"
            onClick={() => {
              setBatchText("");
              update({ batch: undefined, framer: undefined, from: undefined, to: undefined, method: undefined, status: undefined });
            }}
          >
            Clear filters
          </button>
        )}
      </div>

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

      <section aria-label="Mountings" className="rounded-card bg-paper-sheet shadow-card" aria-busy={list.isFetching}>
        {list.isPending ? (
          <SkeletonRows />
        ) : list.isError ? (
          <div className="p-4">
            <Notice tone="fail" title="The mountings register could not be loaded">
              {list.error.message}
            </Notice>
          </div>
        ) : list.data.items.length === 0 ? (
          <div className="p-4">
            {batch ? (
              <EmptyState title={`No mounting used board from batch ${batch}`}>
                The batch is matched whole, in capitals or not; check the number on the board's label{otherFilters ? ", or clear the other filters" : ""}.
              </EmptyState>
            ) : filtered ? (
              <EmptyState title="No mounting matches">Widen the dates, or clear the filters.</EmptyState>
            ) : (
              <EmptyState title="No mountings yet" action={<ButtonLink to="/objects">Open the register</ButtonLink>}>
                Every mounting, reframing and correction recorded on an object's page is listed here, with its materials and their batch numbers. Start from
                an object.
              </EmptyState>
            )}
          </div>
        ) : (
          <>
            <div className="overflow-x-auto">
              <table className="w-full border-collapse text-sm">
                <thead className="sticky top-0 z-10 bg-paper-sheet text-left text-ink-soft shadow-[0_1px_0_var(--color-stone)]">
                  <tr>
                    <th scope="col" className="whitespace-nowrap px-3 py-2.5 text-right font-semibold">Mounted</th>
                    <th scope="col" className="whitespace-nowrap px-3 py-2.5 font-semibold">Object number</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Title</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Framer</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Reason</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Method</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Boards</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Glazing</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Batches</th>
                    <th scope="col" className="px-3 py-2.5 font-semibold">Status</th>
                  </tr>
                </thead>
                <tbody>
                  {list.data.items.map((m) => (
                    <tr key={m.id} className="border-b border-stone-light align-top hover:bg-paper-deep/60">
                      <td className="whitespace-nowrap px-3 py-3 text-right num">{formatDate(m.mountedOn)}</td>
                      <td className="whitespace-nowrap px-3 py-3 font-semibold num">
                        <Link to={`/objects/${m.objectId}`} className="text-accent hover:underline">
                          {m.objectNumber}
                        </Link>
                      </td>
                      <td className="px-3 py-3">{m.objectTitle}</td>
                      <td className="px-3 py-3 text-ink-soft">{m.framerName}</td>
                      <td className="px-3 py-3 text-ink-soft">{label(MOUNTING_REASON_LABELS, m.reason)}</td>
                      <td className="px-3 py-3">{label(ATTACHMENT_METHOD_LABELS, m.method)}</td>
                      <td className="px-3 py-3 text-ink-soft">{label(BOARD_GRADE_LABELS, m.boardGrade)}</td>
                      <td className="px-3 py-3 text-ink-soft">{label(GLAZING_TYPE_LABELS, m.glazing)}</td>
                      <td className="whitespace-nowrap px-3 py-3">
                        <Batches m={m} searched={batch || undefined} />
                      </td>
                      <td className="px-3 py-3">
                        <MountingStatusBadge status={m.status} />
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <Pagination page={page} pageSize={PAGE_SIZE} total={list.data.total} onPage={(p) => update({ page: String(p) }, false)} />
          </>
        )}
      </section>
    </div>
  );
}

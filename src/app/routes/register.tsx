import { useEffect, useState } from "react";
import { useSearchParams } from "react-router";
import {
  OBJECT_STATUSES,
  OBJECT_STATUS_LABELS,
  OBJECT_TYPES,
  OBJECT_TYPE_LABELS,
  REGISTER_BOARD_GRADES,
  REGISTER_GLAZINGS,
  REGISTER_METHODS,
  type ObjectStatus,
  type ObjectType,
  type RegisterBoardGrade,
  type RegisterGlazing,
  type RegisterMethod,
} from "@shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "@shared/schemas/mountings.ts";
import { can, isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObjects } from "@/features/objects/api/objects.ts";
import { studioToday } from "@/lib/today.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { ObjectsTable, type SortKey } from "@/features/objects/components/objects-table.tsx";
import { FilterSelect, SearchInput } from "@/components/ui/field.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { useDebounced } from "@/lib/use-debounced.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { LabelButton } from "@/features/documents/components/label-button.tsx";
import { LABEL_SHEET_MAX } from "@shared/schemas/documents.ts";

const PAGE_SIZE = 50;
/** "Last mounted" opens newest first: recent mountings are the ones usually asked about. */
const FIRST_DIR: Partial<Record<SortKey, "asc" | "desc">> = { lastMountedOn: "desc" };
const oneOf = <T extends string>(list: readonly T[], v: string | null): T | undefined => (v && (list as readonly string[]).includes(v) ? (v as T) : undefined);

export function Component() {
  const { data: user } = useMe();
  const studio = !!user && isStudio(user);
  const { unit } = useStudio();
  const [params, setParams] = useSearchParams();
  const [q, setQ] = useState(params.get("q") ?? "");
  const debouncedQ = useDebounced(q.trim());

  const sort = (params.get("sort") as SortKey) ?? "objectNumber";
  const dir = (params.get("dir") as "asc" | "desc") ?? "asc";
  const page = Math.max(1, Number(params.get("page") ?? 1) || 1);
  const status = (params.get("status") as ObjectStatus) || undefined;
  const objectType = (params.get("type") as ObjectType) || undefined;
  const clientId = params.get("client") || undefined;
  const method = oneOf<RegisterMethod>(REGISTER_METHODS, params.get("method"));
  const boardGrade = oneOf<RegisterBoardGrade>(REGISTER_BOARD_GRADES, params.get("board"));
  const glazing = oneOf<RegisterGlazing>(REGISTER_GLAZINGS, params.get("glazing"));
  const due = params.get("due") === "1";
  // The server has no clock for "due": a check due today is due wherever the framer is.
  const today = studioToday();

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
    if ((params.get("q") ?? "") !== debouncedQ) update({ q: debouncedQ || undefined });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [debouncedQ]);

  const list = useObjects({
    q: debouncedQ || undefined,
    status,
    objectType,
    clientId,
    method,
    boardGrade,
    glazing,
    checkDueBy: due ? today : undefined,
    sort,
    dir,
    page,
    pageSize: PAGE_SIZE,
  });
  const clients = useClients(studio);
  const title = studio ? "Register" : user?.role === "registrar" ? "Collection" : "My collection";
  const filtered = !!(debouncedQ || status || objectType || clientId || method || boardGrade || glazing || due);
  // A schedule of values is one owner's: the chosen owner for the studio, the signed-in client's own otherwise.
  const scheduleOwner = studio ? clientId : (user?.clientId ?? undefined);
  const mayValue = !!scheduleOwner && can(user, "valuation:read", { clientId: scheduleOwner });
  const scheduleFilter = { q: debouncedQ || undefined, status, objectType, method, boardGrade, glazing, checkDueBy: due ? today : undefined };

  return (
    <div className="space-y-5">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
          <p className="text-sm text-graphite">
            {studio ? "Every object the studio has recorded. Search by object number, title or maker." : "The objects recorded for you by the studio."}
          </p>
        </div>
        <div className="flex flex-wrap items-start gap-3">
          {mayValue && scheduleOwner ? (
            <DocumentButton
              url={`/api/clients/${scheduleOwner}/documents/schedule`}
              body={scheduleFilter}
              label={Object.values(scheduleFilter).some(Boolean) ? "Schedule of values for these objects (PDF)" : "Schedule of values (PDF)"}
              fallbackName="schedule-of-values.pdf"
            />
          ) : studio ? (
            <span className="max-w-56 text-xs text-graphite">Choose an owner to produce a schedule of values for the objects shown.</span>
          ) : null}
          {can(user, "mounting:write") && filtered && list.data && list.data.total > 0 && list.data.total <= LABEL_SHEET_MAX ? (
            <LabelButton
              url="/api/documents/label-sheet"
              body={{ ...scheduleFilter, clientId }}
              label={`Back labels for these ${list.data.total} object${list.data.total === 1 ? "" : "s"} (PDF)`}
              fallbackName="back-labels.pdf"
              compact
            />
          ) : null}
          {can(user, "object:create") && <ButtonLink to="/objects/new">New object</ButtonLink>}
        </div>
      </header>

      <div role="search" className="flex flex-wrap items-center gap-3">
        <label className="sr-only" htmlFor="register-search">
          Search objects
        </label>
        <SearchInput id="register-search" placeholder="Object number, title or maker" value={q} onChange={(e) => setQ(e.target.value)} className="max-w-sm" />
        {studio && (
          <FilterSelect aria-label="Owner" value={clientId ?? ""} onChange={(e) => update({ client: e.target.value || undefined })}>
            <option value="">All owners</option>
            {clients.data?.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </FilterSelect>
        )}
        <FilterSelect aria-label="Status" value={status ?? ""} onChange={(e) => update({ status: e.target.value || undefined })}>
          <option value="">Any status</option>
          {OBJECT_STATUSES.map((s) => (
            <option key={s} value={s}>
              {OBJECT_STATUS_LABELS[s]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect aria-label="Object type" value={objectType ?? ""} onChange={(e) => update({ type: e.target.value || undefined })}>
          <option value="">Any type</option>
          {OBJECT_TYPES.map((t) => (
            <option key={t} value={t}>
              {OBJECT_TYPE_LABELS[t]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect aria-label="Method" value={method ?? ""} onChange={(e) => update({ method: e.target.value || undefined })}>
          <option value="">Any method</option>
          {REGISTER_METHODS.map((m) => (
            <option key={m} value={m}>
              {ATTACHMENT_METHOD_LABELS[m]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect aria-label="Board grade" value={boardGrade ?? ""} onChange={(e) => update({ board: e.target.value || undefined })}>
          <option value="">Any board</option>
          {REGISTER_BOARD_GRADES.map((g) => (
            <option key={g} value={g}>
              {BOARD_GRADE_LABELS[g]}
            </option>
          ))}
        </FilterSelect>
        <FilterSelect aria-label="Glazing" value={glazing ?? ""} onChange={(e) => update({ glazing: e.target.value || undefined })}>
          <option value="">Any glazing</option>
          {REGISTER_GLAZINGS.map((g) => (
            <option key={g} value={g}>
              {GLAZING_TYPE_LABELS[g]}
            </option>
          ))}
        </FilterSelect>
        <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" className="h-4 w-4 accent-accent" checked={due} onChange={(e) => update({ due: e.target.checked ? "1" : undefined })} />
          Due for a check
        </label>
        {filtered && (
          <button
            type="button"
            className="text-sm font-medium text-accent hover:underline"
            onClick={() => {
              setQ("");
              update({ q: undefined, status: undefined, type: undefined, client: undefined, method: undefined, board: undefined, glazing: undefined, due: undefined });
            }}
          >
            Clear filters
          </button>
        )}
      </div>

      <section aria-label="Objects" className="rounded-card bg-paper-sheet shadow-card" aria-busy={list.isFetching}>
        {list.isPending ? (
          <SkeletonRows />
        ) : list.isError ? (
          <div className="p-4">
            <Notice tone="fail" title="The register could not be loaded">
              {list.error.message}
            </Notice>
          </div>
        ) : list.data.items.length === 0 ? (
          <div className="p-4">
            {due && !(debouncedQ || status || objectType || clientId || method || boardGrade || glazing) ? (
              <EmptyState title="No object is due for a check">Every object with a planned check has it after today.</EmptyState>
            ) : filtered ? (
              <EmptyState title="No object matches">Try fewer words, or clear the filters.</EmptyState>
            ) : (
              <EmptyState
                title="No objects yet"
                action={can(user, "object:create") ? <ButtonLink to="/objects/new">Record the first object</ButtonLink> : undefined}
              >
                The register lists every work the studio receives, with its catalogue, mount and condition history.
              </EmptyState>
            )}
          </div>
        ) : (
          <>
            <ObjectsTable
              items={list.data.items}
              unit={unit}
              sort={sort}
              dir={dir}
              showOwner={studio}
              today={today}
              onSort={(k) => update({ sort: k, dir: sort === k ? (dir === "asc" ? "desc" : "asc") : (FIRST_DIR[k] ?? "asc") })}
            />
            <Pagination page={page} pageSize={PAGE_SIZE} total={list.data.total} onPage={(p) => update({ page: String(p) }, false)} />
          </>
        )}
      </section>
    </div>
  );
}

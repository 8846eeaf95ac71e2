import {
  OBJECT_STATUSES,
  OBJECT_STATUS_LABELS,
  OBJECT_TYPES,
  OBJECT_TYPE_LABELS,
  RegisterAddressSchema,
  REGISTER_BOARD_GRADES,
  REGISTER_GLAZINGS,
  REGISTER_METHODS,
} from "@shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "@shared/schemas/mountings.ts";
import { can, isStudio } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObjects } from "@/features/objects/api/objects.ts";
import { studioToday } from "@/lib/today.ts";
import { useClients } from "@/features/clients/api/clients.ts";
import { ObjectsTable, type SortKey } from "@/features/objects/components/objects-table.tsx";
import { SearchInput } from "@/components/ui/field.tsx";
import { ClearFilters, EnumFilter, RecordFilter } from "@/components/ui/filters.tsx";
import { ListSection, noItems, PageHeader } from "@/components/ui/list-page.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { EmptyState } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { useSearchState, useSearchText } from "@/lib/use-search-state.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { LabelButton } from "@/features/documents/components/label-button.tsx";
import { LABEL_SHEET_MAX } from "@shared/schemas/documents.ts";

const PAGE_SIZE = 50;
/** "Last mounted" opens newest first: recent mountings are the ones usually asked about. */
const FIRST_DIR: Partial<Record<SortKey, "asc" | "desc">> = { lastMountedOn: "desc" };

/** The register's address: the shared list query's fields, with "due for a check" as a switch (the day is the studio's today). */
const RegisterSearchSchema = RegisterAddressSchema;
const NAMES = { objectType: "type", clientId: "client", boardGrade: "board" } as const;

export function Component() {
  const { data: user } = useMe();
  const studio = !!user && isStudio(user);
  const { unit } = useStudio();
  const { state, set: update } = useSearchState(RegisterSearchSchema, { names: NAMES });
  const { sort, dir, page, status, objectType, clientId, method, boardGrade, glazing } = state;
  const search = useSearchText(state.q, (q) => update({ q }));
  const debouncedQ = search.debounced;
  const due = state.due === "1";
  // The server has no clock for "due": a check due today is due wherever the framer is.
  const today = studioToday();

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
      <PageHeader
        title={title}
        intro={studio ? "Every object the studio has recorded. Search by object number, title or maker." : "The objects recorded for you by the studio."}
        actions={
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
            {can(user, "label:print") && filtered && list.data && list.data.total > 0 && list.data.total <= LABEL_SHEET_MAX ? (
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
        }
      />

      <search aria-label="Search the register" className="flex flex-wrap items-center gap-3">
        <label className="sr-only" htmlFor="register-search">
          Search objects
        </label>
        <SearchInput id="register-search" placeholder="Object number, title or maker" value={search.text} onChange={(e) => search.setText(e.target.value)} className="max-w-sm" />
        {studio && <RecordFilter label="Owner" any="All owners" items={clients.data} value={clientId} onChange={(v) => update({ clientId: v })} />}
        <EnumFilter label="Status" any="Any status" values={OBJECT_STATUSES} labels={OBJECT_STATUS_LABELS} value={status} onChange={(v) => update({ status: v })} />
        <EnumFilter label="Object type" any="Any type" values={OBJECT_TYPES} labels={OBJECT_TYPE_LABELS} value={objectType} onChange={(v) => update({ objectType: v })} />
        <EnumFilter label="Method" any="Any method" values={REGISTER_METHODS} labels={ATTACHMENT_METHOD_LABELS} value={method} onChange={(v) => update({ method: v })} />
        <EnumFilter label="Board grade" any="Any board" values={REGISTER_BOARD_GRADES} labels={BOARD_GRADE_LABELS} value={boardGrade} onChange={(v) => update({ boardGrade: v })} />
        <EnumFilter label="Glazing" any="Any glazing" values={REGISTER_GLAZINGS} labels={GLAZING_TYPE_LABELS} value={glazing} onChange={(v) => update({ glazing: v })} />
        <label className="inline-flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" className="h-4 w-4 accent-accent" checked={due} onChange={(e) => update({ due: e.target.checked ? "1" : undefined })} />
          Due for a check
        </label>
        <ClearFilters
          shown={filtered}
          onClear={() => {
            search.setText("");
            update({ q: undefined, status: undefined, objectType: undefined, clientId: undefined, method: undefined, boardGrade: undefined, glazing: undefined, due: undefined });
          }}
        />
      </search>

      <ListSection
        label="Objects"
        busy={list.isFetching}
        query={list}
        errorTitle="The register could not be loaded"
        isEmpty={noItems}
        empty={
          due && !(debouncedQ || status || objectType || clientId || method || boardGrade || glazing) ? (
            <EmptyState title="No object is due for a check">Every object with a planned check has it after today.</EmptyState>
          ) : filtered ? (
            <EmptyState title="No object matches">Try fewer words, or clear the filters.</EmptyState>
          ) : (
            <EmptyState title="No objects yet" action={can(user, "object:create") ? <ButtonLink to="/objects/new">Record the first object</ButtonLink> : undefined}>
              The register lists every work the studio receives, with its catalogue, mount and condition history.
            </EmptyState>
          )
        }
      >
        {(data) => (
          <>
            <ObjectsTable
              items={data.items}
              unit={unit}
              sort={sort}
              dir={dir}
              showOwner={studio}
              today={today}
              onSort={(k) => update({ sort: k, dir: sort === k ? (dir === "asc" ? "desc" : "asc") : (FIRST_DIR[k] ?? "asc") })}
            />
            <Pagination page={page} pageSize={PAGE_SIZE} total={data.total} onPage={(p) => update({ page: p }, null)} />
          </>
        )}
      </ListSection>
    </div>
  );
}

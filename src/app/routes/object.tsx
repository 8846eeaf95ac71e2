import type { ReactNode } from "react";
import { Link, useParams } from "react-router";
import { OBJECT_TYPE_LABELS, PHOTO_PROCESS_LABELS, SENSITIVITY_LABELS, VALUATION_BASIS_LABELS, type ObjectRecord } from "@shared/schemas/objects.ts";
import { formatLength, formatSize, type Unit } from "@shared/domain/units.ts";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { StatusBadge } from "@/features/objects/components/status-badge.tsx";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Badge, Card, EmptyState, Notice, Skeleton } from "@/components/ui/feedback.tsx";
import { formatDate, formatDateTime, formatMoney } from "@/lib/format.ts";
import { useObjectPlan } from "@/features/planner/api/plans.ts";
import { useObjectMountings } from "@/features/mountings/api/mountings.ts";
import { Timeline } from "@/features/history/components/timeline.tsx";
import { CustodyList } from "@/features/custody/components/custody-list.tsx";
import { CustodyForm } from "@/features/custody/components/custody-form.tsx";
import { useObjectCondition } from "@/features/condition/api/condition.ts";
import { PhotoUploader } from "@/features/photos/components/photo-uploader.tsx";
import { PhotoGrid } from "@/features/photos/components/photo-grid.tsx";
import { useObjectDocuments, useRefreshDocuments } from "@/features/documents/api/documents.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { LabelButton } from "@/features/documents/components/label-button.tsx";
import { DocumentsList } from "@/features/documents/components/documents-list.tsx";
import { Cautions, RatingBadge } from "@/features/condition/components/report-view.tsx";
import { CONDITION_CONTEXT_LABELS } from "@shared/schemas/condition.ts";
import { mountSummary } from "@shared/domain/mounting.ts";
import { MOUNTING_REASON_LABELS, MOUNTING_STATUS_LABELS } from "@shared/schemas/mountings.ts";

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[11rem_1fr] gap-3 border-b border-stone-light py-2 last:border-0">
      <dt className="text-sm text-graphite">{label}</dt>
      <dd className="text-sm">{children ?? "—"}</dd>
    </div>
  );
}

function imageArea(o: ObjectRecord, unit: Unit): string | null {
  const b = [o.borderLeftMm, o.borderTopMm, o.borderRightMm, o.borderBottomMm];
  if (b.every((v) => v === null)) return null;
  const [l = 0, t = 0, r = 0, bt = 0] = b.map((v) => v ?? 0);
  const size = formatSize(o.sheetWidthMm - l - r, o.sheetHeightMm - t - bt, unit);
  const sides = `borders: left ${formatLength(l, unit)}, top ${formatLength(t, unit)}, right ${formatLength(r, unit)}, bottom ${formatLength(bt, unit)}`;
  return `${size} (${sides})`;
}

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const { unit, words, settings } = useStudio();
  const q = useObject(id);
  const draft = useObjectPlan(id);
  const mountings = useObjectMountings(id);
  const condition = useObjectCondition(id);
  const documents = useObjectDocuments(id);
  const refreshDocuments = useRefreshDocuments();

  if (q.isPending)
    return (
      <div className="space-y-4">
        <Skeleton className="h-6 w-40" />
        <Skeleton className="h-10 w-96" />
        <Skeleton className="h-64 w-full" />
      </div>
    );
  if (q.isError)
    return (
      <Notice tone="fail" title="Object not found">
        {q.error.message}{" "}
        <Link to="/objects" className="font-medium underline">
          Back to the register
        </Link>
      </Notice>
    );
  const o = q.data;
  const area = imageArea(o, unit);
  const current = mountings.data?.find((m) => m.status === "completed");
  const others = (mountings.data ?? []).filter((m) => m !== current);
  const studioCanMount = can(user, "mounting:write", { clientId: o.clientId });

  return (
    <article className="space-y-6">
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-stone pb-5">
        <div className="flex gap-5">
          <div aria-hidden="true" className="flex h-20 w-20 shrink-0 items-center justify-center rounded-card border border-stone bg-paper-sheet">
            <div
              className="border border-graphite-light bg-paper-deep"
              style={{
                width: `${(56 * Math.min(1, o.sheetWidthMm / o.sheetHeightMm)).toFixed(0)}px`,
                height: `${(56 * Math.min(1, o.sheetHeightMm / o.sheetWidthMm)).toFixed(0)}px`,
              }}
            />
          </div>
          <div>
            <p className="text-sm font-semibold text-accent num">{o.objectNumber}</p>
            <h1 className="text-2xl font-bold tracking-tight">{o.title}</h1>
            <p className="text-ink-soft">
              {o.maker ?? "Maker unknown"}
              {o.dateMade ? `, ${o.dateMade}` : ""}
            </p>
            <div className="mt-2 flex flex-wrap items-center gap-2 text-sm">
              <StatusBadge status={o.status} />
              {o.location && <span className="text-graphite">{o.location}</span>}
              <span className="text-graphite">· Owner: {o.clientName}</span>
            </div>
            <p className="mt-2 text-sm text-graphite" data-testid="current-mount">
              Current {words.mount}: {current ? mountSummary(current.current.data, current.current.plan, { window: "window" }) : "none recorded yet."}
            </p>
          </div>
        </div>
        {can(user, "object:update", { clientId: o.clientId }) && (
          <ButtonLink to={`/objects/${o.id}/edit`} variant="secondary">
            Edit record
          </ButtonLink>
        )}
      </header>

      {condition.data?.[0] && <Cautions cautions={condition.data[0].cautions} />}
      <nav aria-label="Sections of this object" className="flex flex-wrap gap-4 text-sm font-medium">
        {["Record", words.Mount, "History", "Custody", "Condition", "Photos", "Documents"].map((s) => (
          <a key={s} href={`#${s.toLowerCase()}`} className="text-accent hover:underline">
            {s}
          </a>
        ))}
      </nav>

      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Record" className="lg:row-span-2">
          <dl id="record">
            <Row label="Object type">{OBJECT_TYPE_LABELS[o.objectType]}</Row>
            {o.photoProcess && <Row label="Photographic process">{PHOTO_PROCESS_LABELS[o.photoProcess]}</Row>}
            <Row label="Medium and technique">{o.medium}</Row>
            <Row label="Support">{o.support}</Row>
            <Row label="Edition">{o.edition}</Row>
            <Row label="Inscriptions">{o.inscriptions}</Row>
            <Row label="Sheet">
              <span className="num">{formatSize(o.sheetWidthMm, o.sheetHeightMm, unit)}</span>
            </Row>
            <Row label="Image area">{area && <span className="num">{area}</span>}</Row>
            <Row label="Thickness and flatness">{o.thicknessNotes}</Row>
            <Row label="Sensitivities">
              {o.sensitivities.length ? (
                <span className="flex flex-wrap gap-1">
                  {o.sensitivities.map((s) => (
                    <Badge key={s} tone="warn">
                      {SENSITIVITY_LABELS[s]}
                    </Badge>
                  ))}
                </span>
              ) : null}
            </Row>
            {o.valuationVisible && (
              <>
                <Row label="Insured value">
                  {o.valuationMinor !== null && o.valuationCurrency ? <span className="num">{formatMoney(o.valuationMinor, o.valuationCurrency)}</span> : null}
                </Row>
                <Row label="Valuation">
                  {o.valuationDate || o.valuationBasis || o.valuer
                    ? [formatDate(o.valuationDate), o.valuationBasis && VALUATION_BASIS_LABELS[o.valuationBasis], o.valuer].filter(Boolean).join(" · ")
                    : null}
                </Row>
              </>
            )}
            <Row label="Last changed">{formatDate(o.updatedAt)}</Row>
          </dl>
        </Card>
        <Card title={words.Mount}>
          <div id={words.mount} className="space-y-4 text-sm">
            {current ? (
              <div>
                <p className="font-medium">
                  Current: {MOUNTING_REASON_LABELS[current.reason]} of {formatDate(current.mountedOn)} <span className="font-normal text-graphite">by {current.framerName}</span>
                </p>
                <p className="mt-1 num">{mountSummary(current.current.data, current.current.plan)}</p>
                <p className="mt-1 text-graphite">
                  {current.current.plan.level === "pass"
                    ? "✓ Conservation checks pass."
                    : current.current.plan.level === "warn"
                      ? "▲ Some checks need a decision."
                      : "✕ A conservation check fails."}
                </p>
                <ButtonLink to={`/mountings/${current.id}`} variant="secondary" className="mt-2">
                  Open the mounting record
                </ButtonLink>
              </div>
            ) : (
              <EmptyState title={`No ${words.mount} recorded`}>
                Plan the window, borders, glazing and frame from this object's sheet, then record the boards and hinges used.
              </EmptyState>
            )}
            {draft.data && (
              <p className="rounded-card bg-paper-deep px-3 py-2">
                Draft {words.mount} plan, saved {formatDateTime(draft.data.updatedAt)}:{" "}
                <span className="num">
                  window {draft.data.plan.display.aperture} · outer {draft.data.plan.display.outer}
                </span>
              </p>
            )}
            {others.length > 0 && (
              <div>
                <h3 className="mb-1 font-semibold">Other mounting records</h3>
                <ul className="divide-y divide-stone-light">
                  {others.map((m) => (
                    <li key={m.id} className="flex items-center justify-between gap-3 py-1.5">
                      <Link to={`/mountings/${m.id}`} className="text-accent hover:underline">
                        {MOUNTING_REASON_LABELS[m.reason]} · {formatDate(m.mountedOn)}
                      </Link>
                      <Badge tone={m.status === "draft" ? "warn" : "neutral"}>{MOUNTING_STATUS_LABELS[m.status]}</Badge>
                    </li>
                  ))}
                </ul>
              </div>
            )}
            {(studioCanMount || can(user, "plan:write", { clientId: o.clientId })) && (
              <div className="flex flex-wrap gap-2">
                <ButtonLink to={`/objects/${o.id}/plan`} variant={draft.data ? "secondary" : "primary"}>
                  {draft.data ? `Open the ${words.mount} plan` : `Plan the ${words.mount}`}
                </ButtonLink>
                {studioCanMount && (draft.data || current) && (
                  <ButtonLink to={`/objects/${o.id}/mountings/new`}>{current ? "Record a reframing" : "Record the mounting"}</ButtonLink>
                )}
              </div>
            )}
          </div>
        </Card>
        <Card title="History" className="lg:col-span-2">
          <div id="history">
            <Timeline objectId={o.id} />
          </div>
        </Card>
        <Card title="Custody" className="lg:col-span-2">
          <div id="custody" className="space-y-4">
            {can(user, "custody:write", { clientId: o.clientId }) && (
              <CustodyForm objectId={o.id} status={o.status} ownerName={o.clientName} studioName={settings?.studioName ?? "The studio"} />
            )}
            <CustodyList
              objectId={o.id}
              actions={(r) => (
                <DocumentButton
                  url={`/api/custody/${r.id}/document`}
                  label="Receipt (PDF)"
                  fallbackName={`receipt-${o.objectNumber}.pdf`}
                  onIssued={() => refreshDocuments(o.id)}
                />
              )}
            />
          </div>
        </Card>
        <Card title="Condition">
          <div id="condition" className="space-y-3 text-sm">
            {condition.data && condition.data.length > 0 ? (
              <>
                <ul className="divide-y divide-stone-light" data-testid="condition-reports">
                  {condition.data.map((r) => (
                    <li key={r.id} className="flex items-center justify-between gap-3 py-2">
                      <Link to={`/condition/${r.id}`} className="text-accent hover:underline">
                        {formatDate(r.reportDate)} · {CONDITION_CONTEXT_LABELS[r.context]}
                      </Link>
                      <span className="flex items-center gap-2">
                        <RatingBadge rating={r.rating} />
                        {r.status === "draft" && <Badge tone="warn">Draft</Badge>}
                      </span>
                    </li>
                  ))}
                </ul>
                {condition.data.filter((r) => r.status === "signed").length >= 2 && (
                  <Link to={`/objects/${o.id}/condition/compare`} className="font-medium text-accent hover:underline">
                    Compare two reports
                  </Link>
                )}
              </>
            ) : (
              <EmptyState title="No condition report yet">Condition reports with photos record the state of the object at each hand-over.</EmptyState>
            )}
            {can(user, "condition:write", { clientId: o.clientId }) && (
              <ButtonLink to={`/objects/${o.id}/condition/new`} variant="secondary">
                New condition report
              </ButtonLink>
            )}
          </div>
        </Card>
        <Card title="Photos">
          <div id="photos" className="space-y-4">
            <PhotoUploader objectId={o.id} canUpload={can(user, "photo:write", { clientId: o.clientId })} />
            <PhotoGrid objectId={o.id} canUpload={can(user, "photo:write", { clientId: o.clientId })} />
          </div>
        </Card>
        <Card title="Documents" className="lg:col-span-2">
          <div id="documents" className="space-y-4">
            <div className="flex flex-wrap gap-3">
              <DocumentButton
                url={`/api/objects/${o.id}/documents/dossier`}
                label="Object dossier (PDF)"
                fallbackName={`dossier-${o.objectNumber}.pdf`}
                onIssued={() => refreshDocuments(o.id)}
              />
              {can(user, "label:print") && (
                <LabelButton
                  url={`/api/objects/${o.id}/documents/back-label`}
                  label="Back label (PDF)"
                  fallbackName={`back-label-${o.objectNumber}.pdf`}
                  onIssued={() => refreshDocuments(o.id)}
                />
              )}
            </div>
            <DocumentsList items={documents.data ?? []} />
          </div>
        </Card>
      </div>
    </article>
  );
}

import { Link, useParams, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { CONDITION_CONTEXT_LABELS, SEVERITY_LABELS, ZONE_LABELS, type ConditionContext, type Finding } from "@shared/schemas/condition.ts";
import type { ComparisonStatus } from "@shared/domain/condition.ts";
import { PHOTO_KIND_LABELS } from "@shared/schemas/photos.ts";
import { useObjectCondition, useComparison } from "@/features/condition/api/condition.ts";
import { PhotoMarkers } from "@/features/condition/components/photo-markers.tsx";
import { RatingBadge } from "@/features/condition/components/report-view.tsx";
import { FilterSelect } from "@/components/ui/field.tsx";
import { RecordOptions } from "@/components/ui/options.tsx";
import { EmptyState, ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { formatDate } from "@/lib/format.ts";
import { objectPhotosQuery } from "@/features/photos/api/photos.ts";

const STATUS: Record<ComparisonStatus, { label: string; mark: string; cls: string }> = {
  new: { label: "New", mark: "+", cls: "bg-fail-soft text-fail" },
  worsened: { label: "Worsened", mark: "▲", cls: "bg-fail-soft text-fail" },
  unchanged: { label: "Unchanged", mark: "=", cls: "bg-stone-light text-ink-soft" },
  improved: { label: "Improved", mark: "▼", cls: "bg-pass-soft text-pass" },
  "no-longer-seen": { label: "No longer seen", mark: "−", cls: "bg-pass-soft text-pass" },
};
const where = (f: Finding) => (f.location.kind === "zone" ? ZONE_LABELS[f.location.zone] : "on a photo");

type SignedReport = { id: string; reportDate: string; context: ConditionContext };

/** One end of the comparison: a signed report chosen by its date and context. */
function ReportPicker({ label, value, reports, onPick }: { label: string; value: string; reports: SignedReport[]; onPick: (id: string) => void }) {
  return (
    <label className="flex items-center gap-2">
      {label}{" "}
      <FilterSelect value={value} onChange={(e) => onPick(e.target.value)}>
        <RecordOptions items={reports} text={(r) => `${formatDate(r.reportDate)} · ${CONDITION_CONTEXT_LABELS[r.context]}`} />
      </FilterSelect>
    </label>
  );
}

/** Two reports of one object side by side: what is new, worse, the same, better or gone. */
export function Component() {
  const { id = "" } = useParams();
  const [params, setParams] = useSearchParams();
  const reports = useObjectCondition(id);
  const photos = useQuery({ ...objectPhotosQuery(id), enabled: !!id });
  const signed = (reports.data ?? []).filter((r) => r.status === "signed");
  const from = params.get("from") ?? signed[1]?.id ?? "";
  const to = params.get("to") ?? signed[0]?.id ?? "";
  const cmp = useComparison(from, to);
  if (reports.isPending) return <SkeletonRows />;
  if (signed.length < 2) return <EmptyState title="Two signed reports are needed">A comparison sets two condition reports of the object side by side.</EmptyState>;
  const pick = (k: "from" | "to", v: string) =>
    setParams(
      (p) => {
        const n = new URLSearchParams(p);
        n.set(k, v);
        return n;
      },
      { replace: true },
    );
  const counts: Partial<Record<ComparisonStatus, number>> = {};
  for (const f of cmp.data?.findings ?? []) counts[f.status] = (counts[f.status] ?? 0) + 1;

  return (
    <div className="space-y-5">
      <header>
        <p className="text-sm font-semibold text-accent">
          <Link to={`/objects/${id}`} className="hover:underline">
            Back to the object
          </Link>
        </p>
        <h1 className="text-2xl font-bold tracking-tight">Compare condition reports</h1>
      </header>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <ReportPicker label="Earlier" value={from} reports={signed} onPick={(v) => pick("from", v)} />
        <ReportPicker label="Later" value={to} reports={signed} onPick={(v) => pick("to", v)} />
      </div>
      {cmp.isError && <ErrorNotice error={cmp.error} />}
      {cmp.data && (
        <>
          <p className="flex flex-wrap gap-2 text-sm" data-testid="comparison-counts">
            {(Object.keys(STATUS) as ComparisonStatus[]).map((s) => (
              <span key={s} className={`rounded px-2 py-0.5 font-semibold ${STATUS[s].cls}`}>
                <span aria-hidden="true">{STATUS[s].mark} </span>
                {STATUS[s].label}: {counts[s] ?? 0}
              </span>
            ))}
          </p>
          <div className="overflow-x-auto rounded-card bg-paper-sheet shadow-card">
            <table className="w-full text-sm" data-testid="comparison">
              <thead className="border-b border-stone text-left text-ink-soft">
                <tr>
                  <th scope="col" className="px-3 py-2">
                    Change
                  </th>
                  <th scope="col" className="px-3 py-2">
                    {formatDate(cmp.data.earlier.reportDate)} <RatingBadge rating={cmp.data.earlier.rating} />
                  </th>
                  <th scope="col" className="px-3 py-2">
                    {formatDate(cmp.data.later.reportDate)} <RatingBadge rating={cmp.data.later.rating} />
                  </th>
                </tr>
              </thead>
              <tbody>
                {cmp.data.findings.map((f) => (
                  <tr key={`${f.status}-${f.before?.id ?? ""}-${f.after?.id ?? ""}`} className="border-b border-stone-light align-top">
                    <td className="px-3 py-2">
                      <span className={`rounded px-2 py-0.5 text-xs font-semibold ${STATUS[f.status].cls}`}>
                        <span aria-hidden="true">{STATUS[f.status].mark} </span>
                        {STATUS[f.status].label}
                      </span>
                    </td>
                    <td className="px-3 py-2">
                      {f.before
                        ? `${f.before.term} · ${SEVERITY_LABELS[f.before.severity].toLowerCase()} · ${where(f.before)}${f.before.extent ? ` · ${f.before.extent}` : ""}`
                        : "—"}
                    </td>
                    <td className="px-3 py-2">
                      {f.after ? `${f.after.term} · ${SEVERITY_LABELS[f.after.severity].toLowerCase()} · ${where(f.after)}${f.after.extent ? ` · ${f.after.extent}` : ""}` : "—"}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="grid gap-4 md:grid-cols-2">
            {[cmp.data.earlier, cmp.data.later].map((r) => (
              <div key={r.id} className="space-y-2">
                <h2 className="font-semibold">
                  {formatDate(r.reportDate)} · {CONDITION_CONTEXT_LABELS[r.context]}
                </h2>
                {(photos.data ?? [])
                  .filter((p) => r.current.data.photoIds.includes(p.id))
                  .map((p) => (
                    <figure key={p.id}>
                      <PhotoMarkers
                        src={p.urls.web}
                        alt={p.caption ?? PHOTO_KIND_LABELS[p.kind]}
                        markers={r.current.data.findings
                          .map((f, i) => ({ f, n: i + 1 }))
                          .filter(({ f }) => f.location.kind === "marker" && f.location.photoId === p.id)
                          .map(({ f, n }) => ({ id: f.id, n, x: (f.location as { x: number }).x, y: (f.location as { y: number }).y, tone: f.severity }))}
                      />
                      <figcaption className="text-xs text-graphite">{PHOTO_KIND_LABELS[p.kind]}</figcaption>
                    </figure>
                  ))}
              </div>
            ))}
          </div>
        </>
      )}
    </div>
  );
}

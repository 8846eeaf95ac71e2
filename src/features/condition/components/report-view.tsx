import { useState } from "react";
import { RATING_LABELS, SEVERITY_LABELS, ZONE_LABELS, type ConditionData, type Rating } from "@shared/schemas/condition.ts";
import type { Photo } from "@shared/schemas/photos.ts";
import { PHOTO_KIND_LABELS } from "@shared/schemas/photos.ts";
import { Notice } from "@/components/ui/feedback.tsx";
import { formatDate } from "@/lib/format.ts";
import { PhotoMarkers } from "./photo-markers.tsx";

const RATING_TONE: Record<Rating, { mark: string; cls: string }> = {
  good: { mark: "●", cls: "bg-pass-soft text-pass" },
  fair: { mark: "◐", cls: "bg-warn-soft text-warn" },
  poor: { mark: "▲", cls: "bg-fail-soft text-fail" },
  unstable: { mark: "✕", cls: "bg-fail text-paper-sheet" },
};

export function RatingBadge({ rating }: { rating: Rating }) {
  return (
    <span className={`inline-flex items-center gap-1 rounded px-2 py-0.5 text-xs font-semibold ${RATING_TONE[rating].cls}`}>
      <span aria-hidden="true">{RATING_TONE[rating].mark}</span>
      {RATING_LABELS[rating]}
    </span>
  );
}

/** Handling cautions for findings such as mould or insects: calm, specific, with who to refer to. */
export function Cautions({ cautions }: { cautions: string[] }) {
  if (cautions.length === 0) return null;
  return (
    <div className="space-y-2">
      {cautions.map((c) => (
        <Notice key={c} tone="warn" title="Handling caution">
          {c}
        </Notice>
      ))}
    </div>
  );
}

export function ReportView({ data, photos, cautions }: { data: ConditionData; photos: Photo[]; cautions: string[] }) {
  const shown = photos.filter((p) => data.photoIds.includes(p.id));
  const [selected, setSelected] = useState<string | null>(null);
  return (
    <div className="space-y-5">
      <Cautions cautions={cautions} />
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="space-y-4 text-sm">
          <div className="rounded-card bg-paper-sheet p-4 shadow-card">
            <div className="mb-2 flex items-center gap-2">
              <h2 className="font-semibold">Overall</h2>
              <RatingBadge rating={data.overallRating} />
            </div>
            <p className="whitespace-pre-line">{data.summary}</p>
          </div>
          <div className="rounded-card bg-paper-sheet p-4 shadow-card">
            <h2 className="mb-2 font-semibold">Findings ({data.findings.length})</h2>
            {data.findings.length === 0 ? (
              <p className="text-graphite">No findings recorded.</p>
            ) : (
              <ol className="divide-y divide-stone-light" data-testid="findings">
                {data.findings.map((f, i) => (
                  <li key={f.id} className={`flex gap-3 py-2 ${selected === f.id ? "bg-accent-soft" : ""}`}>
                    <span className="flex h-6 w-6 shrink-0 items-center justify-center rounded-full border-2 border-ink text-xs font-bold">{i + 1}</span>
                    <div>
                      <p className="font-medium">
                        {f.term}{" "}
                        <span className="font-normal text-graphite">
                          · {SEVERITY_LABELS[f.severity].toLowerCase()}
                          {f.resolved ? " · resolved" : ""}
                        </span>
                      </p>
                      <p className="text-ink-soft">
                        {f.location.kind === "zone"
                          ? ZONE_LABELS[f.location.zone]
                          : `Marked on the ${PHOTO_KIND_LABELS[photos.find((p) => p.id === (f.location as { photoId: string }).photoId)?.kind ?? "detail"].toLowerCase()} photo`}
                        {f.extent ? ` · ${f.extent}` : ""}
                      </p>
                      {f.notes && <p className="text-graphite">{f.notes}</p>}
                    </div>
                  </li>
                ))}
              </ol>
            )}
          </div>
          <div className="rounded-card bg-paper-sheet p-4 shadow-card">
            <h2 className="mb-2 font-semibold">Recommendations</h2>
            <dl className="space-y-1">
              {(["display", "handling", "environment", "referral"] as const).map((k) =>
                data.recommendations[k] ? (
                  <div key={k} className="grid grid-cols-[8rem_1fr] gap-2">
                    <dt className="capitalize text-graphite">{k === "referral" ? "Conservator" : k}</dt>
                    <dd className="whitespace-pre-line">{data.recommendations[k]}</dd>
                  </div>
                ) : null,
              )}
            </dl>
            {data.lightNotes && <p className="mt-3 rounded-card bg-paper-deep p-3 text-ink-soft">{data.lightNotes}</p>}
            <p className="mt-3 text-xs text-graphite">Findings are observations, not treatment advice: refer any treatment to a qualified conservator.</p>
          </div>
          <div className="rounded-card bg-paper-sheet p-4 shadow-card">
            <h2 className="mb-2 font-semibold">Signatures</h2>
            {data.signatures.examiner ? (
              <p>
                Examiner: {data.signatures.examiner.name}, {formatDate(data.signatures.examiner.date)}
              </p>
            ) : (
              <p className="text-graphite">Not signed yet.</p>
            )}
            {data.signatures.otherParty && (
              <p>
                Other party: {data.signatures.otherParty.name}
                {data.signatures.otherParty.role ? ` (${data.signatures.otherParty.role})` : ""}, {formatDate(data.signatures.otherParty.date)}
              </p>
            )}
          </div>
        </div>
        <div className="space-y-4">
          {shown.length === 0 ? (
            <p className="rounded-card bg-paper-sheet p-4 text-sm text-graphite shadow-card">No photos in this report.</p>
          ) : (
            shown.map((p) => (
              <figure key={p.id} className="rounded-card bg-paper-sheet p-3 shadow-card">
                <PhotoMarkers
                  src={p.urls.web}
                  alt={p.caption ?? PHOTO_KIND_LABELS[p.kind]}
                  selectedId={selected}
                  onSelect={setSelected}
                  markers={data.findings
                    .map((f, i) => ({ f, n: i + 1 }))
                    .filter(({ f }) => f.location.kind === "marker" && f.location.photoId === p.id)
                    .map(({ f, n }) => ({ id: f.id, n, x: (f.location as { x: number }).x, y: (f.location as { y: number }).y, tone: f.severity }))}
                />
                <figcaption className="mt-1 text-xs text-graphite">
                  {PHOTO_KIND_LABELS[p.kind]}
                  {p.caption ? ` · ${p.caption}` : ""}
                  {p.takenAt ? ` · taken ${formatDate(p.takenAt)}` : ""}
                </figcaption>
              </figure>
            ))
          )}
        </div>
      </div>
    </div>
  );
}

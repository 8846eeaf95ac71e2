import type { ReactNode } from "react";
import { BACKING_TYPE_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS, SEALING_TYPE_LABELS, type Board, type MountingRevision } from "@shared/schemas/mountings.ts";
import { SIDES } from "@shared/schemas/mount-plan.ts";
import { lengthText, planDrawing } from "@shared/domain/mount-plan/index.ts";
import { recordPlan, type PlanSettings } from "@shared/domain/mounting.ts";
import { PlanDrawing } from "@/components/plan-drawing.tsx";
import { ChecksList, LevelBadge } from "@/components/checks-list.tsx";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS as ATTACHMENT_LABELS } from "@shared/schemas/mountings.ts";

function Row({ label, children }: { label: string; children: ReactNode }) {
  if (children === null || children === undefined || children === "") return null;
  return (
    <div className="grid grid-cols-[10rem_1fr] gap-3 border-b border-stone-light py-1.5 last:border-0">
      <dt className="text-graphite">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** A row whose value is a figure, set in the tabular numerals. */
function NumRow({ label, children }: { label: string; children: ReactNode }) {
  return (
    <Row label={label}>
      <span className="num">{children}</span>
    </Row>
  );
}

const boardLine = (b: Board) =>
  [BOARD_GRADE_LABELS[b.grade], `${b.ply}-ply`, b.buffered ? "buffered" : "unbuffered", b.colour, b.maker, b.batch && `batch ${b.batch}`, b.patPassed ? "PAT passed" : null]
    .filter(Boolean)
    .join(" · ");

/** One revision of a mounting record: the plan drawn with its hinges, the materials, the checks and how to undo it. */
export function MountingView({ revision, settings }: { revision: MountingRevision; settings: PlanSettings }) {
  const d = revision.data;
  // Recomputed here from the saved input and the catalogue with the same function as the server's `plan`.
  const r = recordPlan(d, revision.catalogue, settings);
  const plan = r.ok ? r.plan : revision.plan;
  // One unit on the screen: the studio's, for the plan's figures and every other length alike.
  const unit = settings.unit;
  const len = (mm: number) => lengthText(mm, unit);
  const model = r.ok
    ? planDrawing(
        r.geometry,
        d.attachment.hinges.map((h) => ({ edge: h.edge, offset: h.offsetMm, width: h.widthMm })),
      )
    : null;
  return (
    <div className="grid gap-5 lg:grid-cols-2">
      <div className="space-y-3">
        <div className="rounded-card bg-paper-sheet p-4 shadow-card">
          {model && <PlanDrawing model={model} title={`Mount drawn to scale: window ${plan.display.aperture}, with ${d.attachment.hinges.length} hinges`} />}
        </div>
        <div className="rounded-card border-l-4 border-accent bg-paper-sheet p-4 shadow-card">
          <h3 className="font-semibold">How to undo this mounting</h3>
          <p className="mt-1 whitespace-pre-line text-sm" data-testid="undo-notes">
            {d.undoNotes}
          </p>
        </div>
      </div>
      <div className="space-y-3">
        <dl className="rounded-card bg-paper-sheet p-4 text-sm shadow-card">
          <NumRow label="Sheet">{plan.display.sheet}</NumRow>
          <NumRow label="Window (aperture)">{plan.display.aperture}</NumRow>
          <NumRow label="Overlap L · T · R · B">{SIDES.map((s) => plan.display[`overlap.${s}`]).join(" · ")}</NumRow>
          <NumRow label="Borders L · T · R · B">{SIDES.map((s) => plan.display[`borders.${s}`]).join(" · ")}</NumRow>
          {plan.display.topWindow && <NumRow label="Top board window">{plan.display.topWindow}</NumRow>}
          <NumRow label="Outer = glazing = backing">{plan.display.outer}</NumRow>
          <NumRow label="Rebate">{plan.display.rebate}</NumRow>
          <Row label="Window board">{boardLine(d.boards.window)}</Row>
          {d.boards.top && <Row label="Top board">{boardLine(d.boards.top)}</Row>}
          <Row label="Backing board">{boardLine(d.boards.backing)}</Row>
          <Row label="Attachment">
            {[
              ATTACHMENT_LABELS[d.attachment.method],
              d.attachment.tissue,
              d.attachment.tissueWeightGsm && `${d.attachment.tissueWeightGsm} g/m²`,
              d.attachment.adhesive && ADHESIVE_LABELS[d.attachment.adhesive],
            ]
              .filter(Boolean)
              .join(" · ")}
          </Row>
          {d.attachment.hinges.length > 0 && (
            <Row label="Hinges">
              <ol className="num">
                {d.attachment.hinges.map((h, i) => (
                  // biome-ignore lint/suspicious/noArrayIndexKey: a saved record's hinges never reorder; the number is the hinge's name
                  <li key={i}>
                    {i + 1}. {h.edge} edge, {len(h.offsetMm)} from the corner, {len(h.widthMm)} wide
                  </li>
                ))}
              </ol>
            </Row>
          )}
          <Row label="Glazing">{[GLAZING_TYPE_LABELS[d.glazing.type], d.glazing.thicknessMm && len(d.glazing.thicknessMm)].filter(Boolean).join(" · ")}</Row>
          <Row label="Spacer">{[d.spacer?.type, d.spacer?.depthMm && `${len(d.spacer.depthMm)} deep`].filter(Boolean).join(" · ")}</Row>
          <Row label="Frame">
            {[
              d.frame?.moulding,
              d.frame?.finish,
              d.frame?.faceWidthMm && `${len(d.frame.faceWidthMm)} face`,
              d.frame?.rebateDepthMm && `${len(d.frame.rebateDepthMm)} rebate depth`,
            ]
              .filter(Boolean)
              .join(" · ")}
          </Row>
          <Row label="Backing">{d.backing && [BACKING_TYPE_LABELS[d.backing.type], d.backing.notes].filter(Boolean).join(" · ")}</Row>
          <Row label="Sealing">{d.sealing && [SEALING_TYPE_LABELS[d.sealing.type], d.sealing.notes].filter(Boolean).join(" · ")}</Row>
          <Row label="Hanging">{[d.hanging?.hardware, d.hanging?.wire, d.hanging?.notes].filter(Boolean).join(" · ")}</Row>
          <Row label="Notes">{d.notes}</Row>
        </dl>
        <div className="rounded-card bg-paper-sheet p-4 text-sm shadow-card">
          <div className="mb-2 flex items-center justify-between gap-2">
            <h3 className="font-semibold">Conservation checks</h3>
            <LevelBadge level={plan.level} />
          </div>
          <ChecksList checks={plan.checks} />
        </div>
      </div>
    </div>
  );
}

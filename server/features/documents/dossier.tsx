import type { ReactNode } from "react";
import { View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { can } from "../../../shared/permissions.ts";
import { OBJECT_STATUS_LABELS, OBJECT_TYPE_LABELS, PHOTO_PROCESS_LABELS, SENSITIVITY_LABELS } from "../../../shared/schemas/objects.ts";
import {
  ADHESIVE_LABELS,
  ATTACHMENT_METHOD_LABELS,
  BACKING_TYPE_LABELS,
  GLAZING_TYPE_LABELS,
  MOUNTING_REASON_LABELS,
  MOUNTING_STATUS_LABELS,
  SEALING_TYPE_LABELS,
  type MountingData,
  type MountingRecord,
} from "../../../shared/schemas/mountings.ts";
import { MountPlanInputSchema, SIDES, type MountPlan } from "../../../shared/schemas/mount-plan.ts";
import { CONDITION_CONTEXT_LABELS, type ConditionReport } from "../../../shared/schemas/condition.ts";
import { lengthText, planDrawing, type DrawingModel, type PlanGeometry, type PlanResult } from "../../../shared/domain/mount-plan/index.ts";
import { draftPlan, mountSummary } from "../../../shared/domain/mounting.ts";
import { formatSize } from "../../../shared/domain/units.ts";
import { vocab } from "../../../shared/schemas/settings.ts";
import { DocShell } from "../../lib/pdf/layout.tsx";
import { PdfPlanDrawing } from "../../lib/pdf/plan-drawing.tsx";
import { ACCENT, GRAPHITE, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { createObjectsService } from "../objects/objects.service.ts";
import { createMountingsService } from "../mountings/mountings.service.ts";
import { mountingDetail } from "../mountings/mounting-detail.ts";
import { findMounting } from "../mountings/mountings.repo.ts";
import { createMountPlansService } from "../mount-plans/mount-plans.service.ts";
import { createConditionService } from "../condition/condition.service.ts";
import { findPhoto, listForObject as photosOfObject } from "../photos/photos.repo.ts";
import { aboutObject, createDocumentsService } from "./documents.service.ts";
import { Caution, KV, KVRows, Lines, para, RatingTag, Table, VerdictTag } from "../../lib/pdf/blocks.tsx";
import { boardLine, FindingsTable, loadPhoto, PhotoGrid, recommendationRows, valuationLine, type LoadedPhoto } from "./record-blocks.tsx";
import { NOT_TREATMENT } from "./condition-pdf.tsx";

/** Said before the framer's undo notes: the owner keeps the record, the bench does the work. */
export const UNDO_IS_BENCH_WORK =
  "For the framer or conservator who will take this mount apart: undoing it is bench work, not something for the owner to try at home. Ask the studio, or a qualified conservator, to do it.";

/** Reads what the user may read; a refusal (403/404) of a section leaves that section out rather than the whole dossier. */
function orNothing<T>(f: () => T, fallback: T): T {
  try {
    return f();
  } catch (e) {
    if ((e as { status?: number }).status === 403 || (e as { status?: number }).status === 404) return fallback;
    throw e;
  }
}

type PlanView = { plan: MountPlan; geometry: PlanGeometry; model: DrawingModel; data: MountingData | null };

/** A recomputed plan (the record's, from mountingDetail as the screen has it, or the planner's draft) drawn, in the studio's unit. */
function planView(r: PlanResult, data: MountingData | null): PlanView | null {
  if (!r.ok) return null;
  const hinges = data ? data.attachment.hinges.map((h) => ({ edge: h.edge, offset: h.offsetMm, width: h.widthMm })) : [];
  return { plan: r.plan, geometry: r.geometry, data, model: planDrawing(r.geometry, hinges) };
}

export async function issueDossier(db: Db, config: Pick<Config, "uploadsDir">, clock: () => Date, user: SessionUser, objectId: string, opts: { inHistory?: boolean } = {}) {
  // get() answers 404 to anyone who may not read the object and strips valuations the user may not see.
  const object = createObjectsService(db).get(user, objectId);
  const showValue = can(user, "valuation:read", { clientId: object.clientId });
  const settings = getSettings(db);
  const unit = settings.unit;
  const w = vocab(settings.vocabulary);
  // Lengths outside the plan's figures (the sheet as catalogued, hinge positions, thicknesses) on the same grid.
  const len = (mm: number) => lengthText(mm, unit);
  const size = (b: { width: number; height: number }) => formatSize(b.width, b.height, unit, { denominator: 64 });

  const mountings = orNothing(() => createMountingsService(db).listForObject(user, objectId), [] as MountingRecord[]);
  const current = mountings.find((m) => m.status === "completed") ?? null;
  const draft = current ? null : orNothing(() => createMountPlansService(db).getDraft(user, objectId), null);
  const detail = current ? mountingDetail(db, findMounting(db, current.id)!) : null;
  const view = detail ? planView(detail.result, detail.data) : draft ? planView(draftPlan(MountPlanInputSchema.parse(draft.input), object, settings), null) : null;

  const reports = orNothing(() => createConditionService(db, clock).listForObject(user, objectId), [] as ConditionReport[]);
  const latest = reports.filter((r) => r.status === "signed").sort((a, b) => (`${a.reportDate}|${a.signedAt}` < `${b.reportDate}|${b.signedAt}` ? 1 : -1))[0] ?? null;
  const photoRows = latest?.current.data.photoIds.length
    ? latest.current.data.photoIds.map((id) => findPhoto(db, id)).filter((p): p is NonNullable<typeof p> => !!p && p.objectId === objectId)
    : orNothing(() => photosOfObject(db, objectId), []);
  const photos = photoRows
    .map((p) => loadPhoto(config, p))
    .filter((p): p is LoadedPhoto => !!p)
    .slice(0, 4);
  const photoNumber = (id: string) => {
    const i = photos.findIndex((p) => p.row.id === id);
    return i < 0 ? null : i + 1;
  };
  const value = showValue ? valuationLine(object) : null;
  const d = current?.current.data ?? null;

  // The plan's figures beside the drawing, as the record page lists them.
  const planRows = (v: PlanView): [string, ReactNode][] => [
    ["Sheet", v.plan.display.sheet],
    ["Window (aperture)", v.plan.display.aperture],
    ["Overlap L · T · R · B", SIDES.map((x) => v.plan.display[`overlap.${x}`]).join(" · ")],
    ["Borders L · T · R · B", SIDES.map((x) => v.plan.display[`borders.${x}`]).join(" · ")],
    ["Outer = glazing = backing", v.plan.display.outer],
    [w.Rebate, v.plan.display.rebate],
    ["Top window", v.plan.display.topWindow],
    [
      "Hinges",
      d && d.attachment.hinges.length > 0 ? (
        <View key="hinges">
          {d.attachment.hinges.map((h, i) => (
            <Text key={i}>{`${i + 1}. ${h.edge} edge, ${len(h.offsetMm)} from the corner, ${len(h.widthMm)} wide`}</Text>
          ))}
        </View>
      ) : null,
    ],
    ["Mounted", current ? `${current.mountedOn}${current.framerName ? ` by ${current.framerName}` : ""}` : null],
  ];
  // The catalogue in two columns: what the object is, then its size, care and whereabouts.
  const catalogueColumns: [string, ReactNode][][] = [
    [
      ["Object number", object.objectNumber],
      ["Title", object.title],
      ["Maker", object.maker],
      ["Date made", object.dateMade],
      ["Object type", OBJECT_TYPE_LABELS[object.objectType]],
      ["Process", object.photoProcess ? PHOTO_PROCESS_LABELS[object.photoProcess] : null],
      ["Medium", object.medium],
      ["Support", object.support],
      ["Edition", object.edition],
      ["Inscriptions", object.inscriptions],
    ],
    [
      ["Sheet (W × H)", size({ width: object.sheetWidthMm, height: object.sheetHeightMm })],
      [
        "Image borders",
        object.borderLeftMm !== null || object.borderTopMm !== null
          ? (
              [
                ["L", object.borderLeftMm],
                ["T", object.borderTopMm],
                ["R", object.borderRightMm],
                ["B", object.borderBottomMm],
              ] as const
            )
              .map(([k, v]) => `${k} ${v === null ? "—" : len(v)}`)
              .join(" · ")
          : null,
      ],
      ["Thickness", object.thicknessNotes],
      ["Sensitivities", object.sensitivities.length ? object.sensitivities.map((x) => SENSITIVITY_LABELS[x]).join(", ") : null],
      ["Owner", object.clientName],
      ["Status", OBJECT_STATUS_LABELS[object.status]],
      ["Location", object.location],
      ["Insured value", value],
    ],
  ];

  // Drawn as large as fits the column: the model's viewBox is in mm.
  const drawingWidth = view ? Math.min(270, (320 * view.model.viewBox[2]) / view.model.viewBox[3]) : 0;

  return createDocumentsService(db, clock, config.uploadsDir).issue({
    kind: "dossier",
    title: `Object dossier ${object.objectNumber}`,
    user,
    inHistory: opts.inHistory,
    ...aboutObject(object),
    render: (meta) => (
      <DocShell meta={meta}>
        <Text style={s.h1}>{object.title}</Text>
        <Text style={[s.small, { marginBottom: 6 }]}>{[object.objectNumber, object.maker, object.dateMade].filter(Boolean).join(" · ")}</Text>
        {current && view ? (
          <Text style={[para, { color: ACCENT }]}>
            Current {w.mount}: {mountSummary(current.current.data, view.plan)}.
          </Text>
        ) : null}

        {/* The heading and the drawing are one block: the drawing cannot split, so neither leaves the other.
            It comes first, under the title, where it always fits: after a long catalogue it would jump to
            the next page and leave half a page empty. The catalogue's rows wrap from page to page. */}
        <View wrap={false}>
          <Text style={s.h2}>{current ? `Current ${w.mount}, drawn to scale` : draft ? `Planned ${w.mount} (draft plan, not yet mounted), drawn to scale` : `${w.Mount}`}</Text>
          {view ? (
            <View style={{ flexDirection: "row", gap: 14 }}>
              <View style={{ width: drawingWidth }}>
                <PdfPlanDrawing model={view.model} width={drawingWidth} />
                <Text
                  style={[s.small, { marginTop: 3 }]}
                >{`Front view; dimensions in ${unit === "in" ? "inches" : "mm"}${d?.attachment.hinges.length ? "; hinges drawn in yellow, positions as listed" : ""}.`}</Text>
              </View>
              <View style={{ flex: 1 }}>
                <KVRows labelWidth={84} rows={planRows(view)} />
              </View>
            </View>
          ) : (
            <Text style={para}>No {w.mount} has been recorded or planned for this object yet.</Text>
          )}
        </View>

        <Text style={s.h2}>Catalogue</Text>
        <View style={{ flexDirection: "row", gap: 16 }}>
          {catalogueColumns.map((rows, i) => (
            <View key={i} style={{ flex: 1 }}>
              <KVRows labelWidth={88} rows={rows} />
            </View>
          ))}
        </View>

        {d ? (
          <>
            <Text style={s.h2}>Boards and materials</Text>
            <KV label={`Window board`}>{boardLine(d.boards.window)}</KV>
            {d.boards.top ? <KV label="Top board">{boardLine(d.boards.top)}</KV> : null}
            <KV label="Backing board">{boardLine(d.boards.backing)}</KV>
            <KV label="Glazing">{[GLAZING_TYPE_LABELS[d.glazing.type], d.glazing.thicknessMm && `${len(d.glazing.thicknessMm)}`].filter(Boolean).join(" · ")}</KV>
            <KV label="Spacer">{[d.spacer?.type, d.spacer?.depthMm && `${len(d.spacer.depthMm)} deep`].filter(Boolean).join(" · ")}</KV>
            <KV label="Frame">
              {[
                d.frame?.moulding,
                d.frame?.finish,
                d.frame?.faceWidthMm && `${len(d.frame.faceWidthMm)} face`,
                d.frame?.rebateDepthMm && `${len(d.frame.rebateDepthMm)} ${w.rebate} depth`,
              ]
                .filter(Boolean)
                .join(" · ")}
            </KV>
            <KV label="Backing">{d.backing ? [BACKING_TYPE_LABELS[d.backing.type], d.backing.notes].filter(Boolean).join(" · ") : null}</KV>
            <KV label="Sealing">{d.sealing ? [SEALING_TYPE_LABELS[d.sealing.type], d.sealing.notes].filter(Boolean).join(" · ") : null}</KV>
            <KV label="Hanging">{[d.hanging?.hardware, d.hanging?.wire, d.hanging?.notes].filter(Boolean).join(" · ")}</KV>

            <Text style={s.h2}>Attachment</Text>
            <KV label="Method">
              {[
                ATTACHMENT_METHOD_LABELS[d.attachment.method],
                d.attachment.tissue,
                d.attachment.tissueWeightGsm && `${d.attachment.tissueWeightGsm} g/m²`,
                d.attachment.adhesive && ADHESIVE_LABELS[d.attachment.adhesive],
              ]
                .filter(Boolean)
                .join(" · ")}
            </KV>
            <KV label="Notes">{d.notes}</KV>
            <View style={{ borderLeftWidth: 2, borderLeftColor: ACCENT, paddingLeft: 8, paddingVertical: 4, marginTop: 6 }} wrap={false}>
              <Text style={{ fontWeight: 700, marginBottom: 2 }}>How to undo this {w.mount}</Text>
              <Text style={[para, { color: GRAPHITE }]}>{UNDO_IS_BENCH_WORK}</Text>
              <Lines text={d.undoNotes} style={para} />
            </View>
          </>
        ) : null}

        {view ? (
          <>
            <Text style={s.h2}>Conservation checks</Text>
            <View style={{ flexDirection: "row", alignItems: "center", marginBottom: 3 }}>
              <Text style={{ color: GRAPHITE, marginRight: 6 }}>Overall</Text>
              <VerdictTag verdict={view.plan.level} />
            </View>
            <Table
              cols={[
                { label: "Check", flex: 1.4 },
                { label: "Verdict", width: 62 },
                { label: "Reason", flex: 3 },
              ]}
              rows={view.plan.checks.map((c) => [c.rule, <VerdictTag key="verdict" verdict={c.verdict} />, c.reason])}
            />
          </>
        ) : null}

        <Text style={s.h2}>Condition</Text>
        {latest ? (
          <>
            <KV label="Latest signed report">{`${latest.reportDate} · ${CONDITION_CONTEXT_LABELS[latest.context]} · examined by ${latest.examinerName}`}</KV>
            <KV label="Overall rating">
              <RatingTag rating={latest.rating} />
            </KV>
            <KV label="Summary">{latest.current.data.summary}</KV>
            {latest.cautions.map((c, i) => (
              <Caution key={i}>{c}</Caution>
            ))}
            {/* Not wrapped in a View: the table keeps itself off the last lines of a page only among its siblings. */}
            <View style={{ height: 4 }} />
            <FindingsTable data={latest.current.data} photoNumber={photoNumber} />
            {recommendationRows(latest.current.data).length > 0 ? (
              <>
                <Text style={[s.h2, { fontSize: 9.5 }]}>Recommendations in that report</Text>
                {recommendationRows(latest.current.data).map(([label, text]) => (
                  <KV key={label} label={label}>
                    {text}
                  </KV>
                ))}
              </>
            ) : null}
            <Text style={[s.small, { marginTop: 4 }]}>{NOT_TREATMENT}</Text>
          </>
        ) : (
          <Text style={para}>No signed condition report has been recorded for this object yet.</Text>
        )}
        {photos.length > 0 ? (
          <View style={{ marginTop: 8 }}>
            <PhotoGrid
              photos={photos}
              data={
                latest?.current.data ?? {
                  overallRating: "good",
                  summary: "",
                  findings: [],
                  recommendations: { display: null, handling: null, environment: null, referral: null },
                  lightNotes: null,
                  photoIds: [],
                  signatures: {},
                }
              }
              columnWidth={250}
            />
          </View>
        ) : null}

        <Text style={s.h2}>Mounting history</Text>
        <Table
          empty="No mounting has been recorded."
          cols={[
            { label: "Date", width: 58 },
            { label: "Status", width: 58 },
            { label: "Reason", width: 80 },
            { label: "Framer", width: 72 },
            { label: "Summary", flex: 1 },
          ]}
          rows={mountings.map((m) => {
            const ended = m.endedOn ? ` Ended ${m.endedOn}${m.endReason ? `: ${m.endReason}` : ""}` : "";
            return [
              m.mountedOn,
              MOUNTING_STATUS_LABELS[m.status],
              MOUNTING_REASON_LABELS[m.reason],
              m.framerName ?? "—",
              `${mountSummary(m.current.data, m.current.plan)}.${ended}`,
            ];
          })}
        />
      </DocShell>
    ),
  });
}

import { useLocation, useNavigate, useParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { lightGuidance } from "@shared/domain/condition.ts";
import { MOUNTING_REASON_LABELS } from "@shared/schemas/mountings.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { useObjectMountings } from "@/features/mountings/api/mountings.ts";
import { useCorrectReport, useCreateReport, useObjectCondition, useReport, useTerms, useUpdateReport } from "@/features/condition/api/condition.ts";
import { ReportForm } from "@/features/condition/components/report-form.tsx";
import { editGate, ObjectLine } from "@/components/revisioned.tsx";
import { formModeOf, saveByMode } from "@/lib/revisioned.ts";
import { SkeletonRows } from "@/components/ui/feedback.tsx";
import { formatDate } from "@/lib/format.ts";
import { objectPhotosQuery } from "@/features/photos/api/photos.ts";

/** New report (/objects/:id/condition/new), a draft (/condition/:id/edit) or a correction (/condition/:id/correct). */
export function Component() {
  const params = useParams();
  const location = useLocation();
  const mode = formModeOf(location.pathname);
  const existing = useReport(mode === "new" ? "" : (params.id ?? ""));
  const objectId = mode === "new" ? (params.id ?? "") : (existing.data?.objectId ?? "");
  const object = useObject(objectId);
  const reports = useObjectCondition(objectId);
  const photos = useQuery({ ...objectPhotosQuery(objectId), enabled: !!objectId });
  const mountings = useObjectMountings(objectId);
  const terms = useTerms();
  const { data: user } = useMe();
  const navigate = useNavigate();
  const create = useCreateReport(objectId);
  const update = useUpdateReport(params.id ?? "");
  const correct = useCorrectReport(params.id ?? "");

  if (object.isPending || terms.isPending || reports.isPending || photos.isPending || mountings.isPending || (mode !== "new" && existing.isPending)) return <SkeletonRows />;
  const gate = editGate(object, user, "condition:write", "Your role cannot write condition reports for this object.");
  if (!gate.ok) return gate.refusal;
  const o = gate.o;
  const previous = (reports.data ?? []).find((r) => r.status === "signed" && r.id !== params.id)?.current.data ?? null;

  return (
    <div className="space-y-5">
      <header>
        <ObjectLine objectId={o.id} objectNumber={o.objectNumber} title={o.title} />
        <h1 className="text-2xl font-bold tracking-tight">
          {mode === "correct" ? "Correct the condition report" : mode === "draft" ? "Condition report (draft)" : "New condition report"}
        </h1>
        <p className="text-sm text-graphite">Record what you see, where, and how severe; the report is an observation, not a treatment.</p>
      </header>
      <ReportForm
        mode={mode}
        objectType={o.objectType}
        photos={photos.data ?? []}
        terms={terms.data ?? []}
        mountings={(mountings.data ?? [])
          .filter((m) => m.status !== "draft")
          .map((m) => ({ id: m.id, label: `${MOUNTING_REASON_LABELS[m.reason]} of ${formatDate(m.mountedOn)}` }))}
        examinerName={user?.name ?? ""}
        lightNotes={lightGuidance(o.sensitivities, o.objectType, o.photoProcess)}
        previous={mode === "new" ? previous : null}
        initial={
          existing.data
            ? { context: existing.data.context, reportDate: existing.data.reportDate, mountingId: existing.data.mountingId, data: existing.data.current.data }
            : undefined
        }
        onCancel={() => navigate(-1)}
        onSubmit={async (v) => {
          const body = { context: v.context, reportDate: v.reportDate, mountingId: v.mountingId, data: v.data };
          const r = await saveByMode(mode, { create, update, correct }, body, existing.data, v.correctionReason);
          navigate(`/condition/${r.id}`);
        }}
      />
    </div>
  );
}

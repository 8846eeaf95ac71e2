import { Link, useParams } from "react-router";
import { can } from "@shared/permissions.ts";
import { lengthInputValue } from "@shared/domain/units.ts";
import type { ObjectRecord } from "@shared/schemas/objects.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { useObjectPlan, useSavePlan } from "@/features/planner/api/plans.ts";
import { Planner } from "@/features/planner/components/planner.tsx";
import { defaultValues, fromInput, type PlannerValues } from "@/features/planner/lib/planner-values.ts";
import { ErrorNotice, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { formatDateTime } from "@/lib/format.ts";

/** A new plan starts from the object record: its sheet, image area and sensitivities. */
function fromObject(o: ObjectRecord, base: PlannerValues): PlannerValues {
  const u = base.unit;
  const v = structuredClone(base);
  v.sheetW = lengthInputValue(o.sheetWidthMm, u);
  v.sheetH = lengthInputValue(o.sheetHeightMm, u);
  const b = [o.borderLeftMm, o.borderTopMm, o.borderRightMm, o.borderBottomMm];
  if (b.some((x) => x !== null)) {
    v.hasImageBorders = true;
    v.ib = {
      left: lengthInputValue(o.borderLeftMm ?? 0, u),
      top: lengthInputValue(o.borderTopMm ?? 0, u),
      right: lengthInputValue(o.borderRightMm ?? 0, u),
      bottom: lengthInputValue(o.borderBottomMm ?? 0, u),
    };
  }
  v.object = { objectType: o.objectType, photoProcess: o.photoProcess ?? "", sensitivities: o.sensitivities };
  return v;
}

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const { settings, words } = useStudio();
  const object = useObject(id);
  const draft = useObjectPlan(id);
  const save = useSavePlan(id);

  if (object.isError) return <ErrorNotice title="Object not found" error={object.error} />;
  if (!settings || object.isPending || draft.isPending) return <SkeletonRows />;
  const o = object.data;
  const base = defaultValues(settings.unit, settings.minOverlapMm);
  const initial = draft.data ? fromInput(draft.data.input, fromObject(o, base)) : fromObject(o, base);
  const writable = can(user, "plan:write", { clientId: o.clientId });

  return (
    <div className="space-y-5 print:space-y-2">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="hidden text-xs text-graphite print:block">
            {settings.studioName} · printed {formatDateTime(new Date().toISOString())}
          </p>
          <p className="text-sm font-semibold text-accent num">
            <Link to={`/objects/${o.id}`} className="hover:underline">
              {o.objectNumber}
            </Link>
          </p>
          <h1 className="text-2xl font-bold tracking-tight print:text-lg">
            {words.Mount} plan · {o.title}
          </h1>
          <p className="text-sm text-graphite print:hidden">
            {draft.data ? `Draft saved ${formatDateTime(draft.data.updatedAt)}.` : "No draft saved yet: the sheet and its border come from the object record."} The mounting record
            that uses this plan comes next.
          </p>
        </div>
      </header>
      <Planner
        key={draft.data?.version ?? 0}
        settings={{ unit: settings.unit, minOverlapMm: settings.minOverlapMm, rebateClearanceMm: settings.rebateClearanceMm, framePresets: settings.framePresets, words }}
        initial={initial}
        onSave={writable ? async (input) => void (await save.mutateAsync({ input, version: draft.data?.version })) : undefined}
        saveState={
          save.isSuccess ? (
            <Notice tone="pass" title="Draft saved">
              The plan is kept on the object as a draft.
            </Notice>
          ) : undefined
        }
      />
    </div>
  );
}

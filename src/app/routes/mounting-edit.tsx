import { Link, useLocation, useNavigate, useParams } from "react-router";
import type { MountPlanInput } from "@shared/schemas/mount-plan.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { useObjectPlan } from "@/features/planner/api/plans.ts";
import { useCorrectMounting, useCreateMounting, useMounting, useObjectMountings, useUpdateMountingDraft } from "@/features/mountings/api/mountings.ts";
import { MountingForm } from "@/features/mountings/components/mounting-form.tsx";
import { editGate, ObjectLine } from "@/components/revisioned.tsx";
import { formModeOf, saveByMode } from "@/lib/revisioned.ts";
import { ButtonLink } from "@/components/ui/button.tsx";
import { Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { studioToday } from "@/lib/today.ts";

/** New mounting (/objects/:id/mountings/new), a draft (/mountings/:id/edit) or a correction (/mountings/:id/correct). */
export function Component() {
  const params = useParams();
  const location = useLocation();
  const mode = formModeOf(location.pathname);
  const mountingId = mode === "new" ? "" : (params.id ?? "");
  const existing = useMounting(mountingId);
  const objectId = mode === "new" ? (params.id ?? "") : (existing.data?.objectId ?? "");
  const object = useObject(objectId);
  const draftPlan = useObjectPlan(objectId);
  const mountings = useObjectMountings(objectId);
  const { data: user } = useMe();
  const { settings } = useStudio();
  const navigate = useNavigate();
  const create = useCreateMounting(objectId);
  const update = useUpdateMountingDraft(mountingId);
  const correct = useCorrectMounting(mountingId);

  if (!settings || object.isPending || (mode !== "new" && existing.isPending) || draftPlan.isPending || mountings.isPending) return <SkeletonRows />;
  const gate = editGate(object, user, "mounting:write", "Only studio staff record mountings.");
  if (!gate.ok) return gate.refusal;
  const o = gate.o;

  // The plan comes from the planner's saved draft (or the record being edited): it is never retyped here.
  const current = mountings.data?.find((m) => m.status === "completed");
  const planInput: MountPlanInput | undefined = mode === "new" ? (draftPlan.data?.input ?? current?.current.data.plan) : existing.data?.current.data.plan;
  if (!planInput) {
    return (
      <div className="max-w-xl space-y-4">
        <h1 className="text-2xl font-bold tracking-tight">Record a mounting</h1>
        <Notice tone="info" title="Plan the mount first">
          The mounting record uses the object's mount plan. Plan the window, borders and glazing, save the draft, then come back here.
        </Notice>
        <ButtonLink to={`/objects/${o.id}/plan`}>Open the planner</ButtonLink>
      </div>
    );
  }
  const initial =
    mode === "new"
      ? current
        ? { reason: "reframing", mountedOn: studioToday(), data: current.current.data }
        : undefined
      : { reason: existing.data!.reason, mountedOn: existing.data!.mountedOn, data: existing.data!.current.data };

  return (
    <div className="space-y-5">
      <header>
        <ObjectLine objectId={o.id} objectNumber={o.objectNumber} title={o.title} />
        <h1 className="text-2xl font-bold tracking-tight">
          {mode === "correct" ? "Correct the mounting record" : mode === "draft" ? "Mounting record (draft)" : current ? "Record a reframing" : "Record a mounting"}
        </h1>
        {mode === "new" && (
          <p className="text-sm text-graphite">
            The plan is the one saved {draftPlan.data ? "in the planner" : "with the current mounting"};{" "}
            <Link className="text-accent underline" to={`/objects/${o.id}/plan`}>
              change it in the planner
            </Link>
            .{current ? " The boards and attachment start from the current mounting." : ""}
          </p>
        )}
      </header>
      <Notice tone="warn" title="At the bench">
        Glass and blades cut: gloves and eye protection, and used blades into a sharps container. Lift heavy frames with two people, never by the top rail.
      </Notice>
      <MountingForm
        mode={mode}
        planInput={planInput}
        settings={settings}
        catalogue={o}
        initial={initial}
        onCancel={() => navigate(-1)}
        onSubmit={async (v) => {
          const m = await saveByMode(mode, { create, update, correct }, { reason: v.reason, mountedOn: v.mountedOn, data: v.data }, existing.data, v.correctionReason);
          navigate(`/mountings/${m.id}`);
        }}
      />
    </div>
  );
}

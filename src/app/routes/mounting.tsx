import { useState } from "react";
import { Link, useParams } from "react-router";
import { studioToday } from "@/lib/today.ts";
import { can } from "@shared/permissions.ts";
import { MOUNTING_REASON_LABELS, MOUNTING_STATUS_LABELS } from "@shared/schemas/mountings.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useStudio } from "@/features/settings/api/settings.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { useCompleteMounting, useMounting, useRemoveMounting, useRevisions } from "@/features/mountings/api/mountings.ts";
import { MountingView } from "@/features/mountings/components/mounting-view.tsx";
import { Badge, Card, ErrorNotice, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Button } from "@/components/ui/button.tsx";
import { TextField } from "@/components/ui/field.tsx";
import { formatDate } from "@/lib/format.ts";
import { RevisionsList } from "@/components/revisions-list.tsx";
import { RecordHead, RevisionedActions } from "@/components/revisioned.tsx";
import { ApiError } from "@/lib/api-client.ts";
import { shownRevision } from "@/lib/revisioned.ts";

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const { settings } = useStudio();
  const m = useMounting(id);
  const object = useObject(m.data?.objectId ?? "");
  const revisions = useRevisions(id, !!m.data && m.data.currentRevision > 1);
  const complete = useCompleteMounting(id);
  const remove = useRemoveMounting(id);
  const [shown, setShown] = useState<number | null>(null);
  const [removing, setRemoving] = useState(false);
  const [endReason, setEndReason] = useState("");
  const [endedOn, setEndedOn] = useState(studioToday);

  if (m.isPending || !settings) return <SkeletonRows />;
  if (m.isError) return <ErrorNotice title="Mounting record not found" error={m.error} />;
  const rec = m.data;
  const writable = !!object.data && can(user, "mounting:write", { clientId: object.data.clientId });
  const revs = revisions.data;
  const showing = shownRevision(shown, revs, rec.current);
  const error = complete.error ?? remove.error;

  return (
    <div className="space-y-5">
      <RecordHead
        record={rec}
        title={`${MOUNTING_REASON_LABELS[rec.reason]} · ${formatDate(rec.mountedOn)}`}
        facts={
          <>
            <Badge tone={rec.status === "completed" ? "accent" : rec.status === "draft" ? "warn" : "neutral"}>{MOUNTING_STATUS_LABELS[rec.status]}</Badge>
            <span>by {rec.framerName}</span>
            {rec.currentRevision > 1 && <span>· revision {rec.currentRevision}</span>}
            {rec.supersededById && (
              <Link className="text-accent underline" to={`/mountings/${rec.supersededById}`}>
                · superseded by a later mounting
              </Link>
            )}
            {rec.endedOn && (
              <span>
                · ended {formatDate(rec.endedOn)}
                {rec.endReason ? `: ${rec.endReason}` : ""}
              </span>
            )}
          </>
        }
        actions={
          writable && (
            <RevisionedActions
              draft={rec.status === "draft"}
              recordTo={`/mountings/${rec.id}`}
              correctLabel="Correct the record"
              lock={{ label: "Complete and lock", onLock: () => complete.mutate(rec.version), pending: complete.isPending }}
            >
              {rec.status === "completed" && (
                <Button variant="secondary" onClick={() => setRemoving(true)}>
                  Taken out of mount…
                </Button>
              )}
            </RevisionedActions>
          )
        }
      />
      {error && <ErrorNotice title="Not done" error={error} />}
      {rec.status === "draft" && (
        <Notice tone="warn" title="Draft">
          This record is a draft. Completing it locks it and makes it the object's current mount{writable ? "; any earlier mounting becomes superseded" : ""}.
        </Notice>
      )}
      {removing && (
        <Card title="Taken out of this mount">
          <div className="grid gap-3 md:grid-cols-[10rem_1fr_auto] md:items-end">
            <TextField label="Date" type="date" value={endedOn} onChange={(e) => setEndedOn(e.target.value)} />
            <TextField
              label="Why"
              value={endReason}
              onChange={(e) => setEndReason(e.target.value)}
              error={remove.error instanceof ApiError ? remove.error.fields.endReason : undefined}
            />
            <Button onClick={() => remove.mutate({ version: rec.version, endedOn, endReason }, { onSuccess: () => setRemoving(false) })} disabled={remove.isPending}>
              Save
            </Button>
          </div>
        </Card>
      )}
      {revs && <RevisionsList revisions={revs} shown={showing.revision} onShow={setShown} />}
      {showing.revision !== rec.currentRevision && (
        <Notice tone="info" title={`Showing revision ${showing.revision}`}>
          This is an earlier revision, kept as it was. The current one is revision {rec.currentRevision}.
        </Notice>
      )}
      <MountingView revision={showing} settings={settings} />
    </div>
  );
}

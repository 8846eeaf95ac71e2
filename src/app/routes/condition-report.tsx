import { useState } from "react";
import { useParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { can } from "@shared/permissions.ts";
import { CONDITION_CONTEXT_LABELS } from "@shared/schemas/condition.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useObject } from "@/features/objects/api/objects.ts";
import { useReport, useReportRevisions, useSignReport } from "@/features/condition/api/condition.ts";
import { RatingBadge, ReportView } from "@/features/condition/components/report-view.tsx";
import { Badge, ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { objectPhotosQuery } from "@/features/photos/api/photos.ts";
import { DocumentButton } from "@/features/documents/components/document-button.tsx";
import { formatDate, formatDateTime } from "@/lib/format.ts";
import { RevisionsList } from "@/components/revisions-list.tsx";
import { RecordHead, RevisionedActions } from "@/components/revisioned.tsx";
import { shownRevision } from "@/lib/revisioned.ts";

export function Component() {
  const { id = "" } = useParams();
  const { data: user } = useMe();
  const r = useReport(id);
  const object = useObject(r.data?.objectId ?? "");
  const photos = useQuery({ ...objectPhotosQuery(r.data?.objectId ?? ""), enabled: !!r.data });
  const revisions = useReportRevisions(id, !!r.data && r.data.currentRevision > 1);
  const sign = useSignReport(id);
  const [shown, setShown] = useState<number | null>(null);

  if (r.isPending) return <SkeletonRows />;
  if (r.isError) return <ErrorNotice title="Condition report not found" error={r.error} />;
  const rep = r.data;
  const writable = !!object.data && can(user, "condition:write", { clientId: object.data.clientId });
  const revision = shownRevision(shown, revisions.data, rep.current);

  return (
    <div className="space-y-5">
      <RecordHead
        record={rep}
        title={`Condition ${CONDITION_CONTEXT_LABELS[rep.context].toLowerCase()} · ${formatDate(rep.reportDate)}`}
        facts={
          <>
            <Badge tone={rep.status === "signed" ? "accent" : "warn"}>{rep.status === "signed" ? "Signed" : "Draft"}</Badge>
            <RatingBadge rating={rep.rating} />
            <span>Examined by {rep.examinerName}</span>
            {rep.signedAt && <span>· signed {formatDateTime(rep.signedAt)}</span>}
            {rep.currentRevision > 1 && <span>· revision {rep.currentRevision}</span>}
          </>
        }
        actions={
          <div className="flex flex-wrap items-start gap-2">
            {rep.status === "signed" && (
              <DocumentButton url={`/api/condition/${rep.id}/document`} label="Report for the insurer (PDF)" fallbackName={`condition-${rep.objectNumber}.pdf`} />
            )}
            {writable && (
              <RevisionedActions
                draft={rep.status === "draft"}
                recordTo={`/condition/${rep.id}`}
                correctLabel="Correct the report"
                lock={{ label: "Sign and lock", onLock: () => sign.mutate(rep.version), pending: sign.isPending }}
              />
            )}
          </div>
        }
      />
      {sign.error && <ErrorNotice title="Not signed" error={sign.error} />}
      {revisions.data && <RevisionsList revisions={revisions.data} shown={revision.revision} onShow={setShown} />}
      <ReportView data={revision.data} photos={photos.data ?? []} cautions={rep.cautions} />
    </div>
  );
}

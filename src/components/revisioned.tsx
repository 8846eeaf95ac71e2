import type { ComponentProps } from "react";
import { Link } from "react-router";
import type { ApiError } from "@/lib/api-client.ts";
import { TextAreaField } from "@/components/ui/field.tsx";
import { Notice } from "@/components/ui/feedback.tsx";

/** Above a revisioned record's page or form: its object's number (a link to the object) and title. */
export function ObjectLine({ objectId, objectNumber, title }: { objectId: string; objectNumber: string; title: string }) {
  return (
    <p className="text-sm font-semibold text-accent num">
      <Link to={`/objects/${objectId}`} className="hover:underline">
        {objectNumber}
      </Link>{" "}
      · {title}
    </p>
  );
}

/**
 * The top of a revisioned record's form: why the last save failed, and, for a correction, what a
 * correction does (`note`) and the reason it must give (the "say why" field, `correctionReason`).
 */
export function RevisionedFormHead({
  error,
  correcting,
  note,
  reason,
}: {
  error: ApiError | null;
  correcting: boolean;
  note: string;
  reason: Omit<ComponentProps<typeof TextAreaField>, "label">;
}) {
  return (
    <>
      {error && (
        <Notice tone="fail" title="Not saved">
          {error.message}
        </Notice>
      )}
      {correcting && (
        <div className="rounded-card bg-paper-sheet p-4 shadow-card">
          <Notice tone="info" title="A correction">
            {note}
          </Notice>
          <TextAreaField label="Reason for the correction" wrapClassName="mt-3" {...reason} />
        </div>
      )}
    </>
  );
}

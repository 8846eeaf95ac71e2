import { Notice } from "@/components/ui/feedback.tsx";
import { useLabelReadiness } from "../api/documents.ts";
import { DocumentButton } from "./document-button.tsx";

/** A button that prints back labels, or, when the labels' QR codes would point nowhere useful, the warning instead. */
export function LabelButton({
  url,
  body,
  label,
  fallbackName,
  onIssued,
  compact = false,
}: {
  url: string;
  body?: unknown;
  label: string;
  fallbackName: string;
  onIssued?: () => void;
  compact?: boolean;
}) {
  const readiness = useLabelReadiness(true);
  if (readiness.isPending) return null;
  if (readiness.data && !readiness.data.ready) {
    // In a toolbar, one line; the object's page gives the whole reason.
    if (compact)
      return (
        <span className="max-w-56 text-xs text-warn" title={readiness.data.problem ?? undefined}>
          Labels need the studio's public address (PUBLIC_URL) before they can be printed.
        </span>
      );
    return (
      <div className="max-w-md">
        <Notice tone="warn" title="Labels are not ready to print">
          {readiness.data.problem}
        </Notice>
      </div>
    );
  }
  return <DocumentButton url={url} body={body} label={label} fallbackName={fallbackName} onIssued={onIssued} />;
}

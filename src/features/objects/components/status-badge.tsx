import { OBJECT_STATUS_LABELS, type ObjectStatus } from "@shared/schemas/objects.ts";
import { Badge } from "@/components/ui/feedback.tsx";

export function StatusBadge({ status }: { status: ObjectStatus }) {
  return <Badge tone={status === "in-studio" ? "accent" : status === "with-conservator" ? "warn" : "neutral"}>{OBJECT_STATUS_LABELS[status]}</Badge>;
}

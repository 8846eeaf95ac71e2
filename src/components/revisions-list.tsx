import type { Change } from "@shared/domain/diff.ts";
import { Card } from "@/components/ui/feedback.tsx";
import { formatDateTime } from "@/lib/format.ts";

type Revision = { revision: number; createdAt: string; createdByName: string | null; correctionReason: string | null; changes: Change[] };

/** The revisions of a locked record (mounting or condition report), each with what it changed; one is shown at a time. */
export function RevisionsList({ revisions, shown, onShow }: { revisions: Revision[]; shown: number; onShow: (n: number) => void }) {
  if (revisions.length < 2) return null;
  return (
    <Card title="Revisions">
      <ol className="space-y-2 text-sm">
        {revisions.map((r) => (
          <li key={r.revision} className="flex flex-wrap items-start gap-3">
            <button
              type="button"
              aria-pressed={shown === r.revision}
              onClick={() => onShow(r.revision)}
              className={`rounded-card border px-2 py-0.5 text-xs font-semibold ${shown === r.revision ? "border-accent bg-accent text-paper-sheet" : "border-stone"}`}
            >
              Revision {r.revision}
            </button>
            <div>
              <p className="text-graphite">
                {formatDateTime(r.createdAt)} · {r.createdByName}
                {r.correctionReason ? ` · “${r.correctionReason}”` : ""}
              </p>
              {r.changes.length > 0 && (
                <ul className="mt-0.5 text-xs" data-testid={`changes-${r.revision}`}>
                  {r.changes.slice(0, 30).map((c) => (
                    <li key={c.path}>
                      <span className="font-medium">{c.path}</span>: <span className="text-fail line-through">{JSON.stringify(c.before)}</span> →{" "}
                      <span className="text-pass">{JSON.stringify(c.after)}</span>
                    </li>
                  ))}
                </ul>
              )}
            </div>
          </li>
        ))}
      </ol>
    </Card>
  );
}

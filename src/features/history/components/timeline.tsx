import { useState } from "react";
import { Link } from "react-router";
import { EVENT_TYPE_LABELS, type EventType, type HistoryEvent } from "@shared/schemas/history.ts";
import { EmptyState, ErrorNotice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Button } from "@/components/ui/button.tsx";
import { formatDate, formatDateTime } from "@/lib/format.ts";
import { useHistory } from "../api/history.ts";

/** Filter groups in the framer's words. */
const GROUPS: { label: string; types: EventType[] }[] = [
  { label: "Everything", types: [] },
  { label: "Mountings", types: ["plan-saved", "mounted", "reframed", "mounting-corrected", "mounting-removed"] },
  { label: "Catalogue and value", types: ["created", "catalogue-changed", "valued"] },
  { label: "Condition", types: ["condition-reported"] },
  { label: "Custody and loans", types: ["custody-in", "custody-out", "loan-out", "loan-return"] },
  { label: "Shared and exported", types: ["shared", "exported"] },
];

function eventLink(e: HistoryEvent): { to: string; label: string } | null {
  const id = typeof e.data.mountingId === "string" ? e.data.mountingId : null;
  if (id) return { to: `/mountings/${id}`, label: "Open the mounting record" };
  return null;
}

/** The object's history, newest first: every mounting, reframing, check and move, with who and when. */
export function Timeline({ objectId }: { objectId: string }) {
  const [group, setGroup] = useState(0);
  const q = useHistory(objectId, GROUPS[group]?.types ?? []);
  const items = q.data?.pages.flatMap((p) => p.items) ?? [];
  return (
    <div className="space-y-3">
      <fieldset aria-label="Show" className="flex flex-wrap gap-1.5">
        {GROUPS.map((g, i) => (
          <button
            key={g.label}
            type="button"
            aria-pressed={group === i}
            onClick={() => setGroup(i)}
            className={`rounded-full border px-3 py-1 text-xs font-medium ${group === i ? "border-accent bg-accent text-paper-sheet" : "border-stone text-ink-soft hover:bg-paper-deep"}`}
          >
            {g.label}
          </button>
        ))}
      </fieldset>
      {q.isPending ? (
        <SkeletonRows rows={4} />
      ) : q.isError ? (
        <ErrorNotice error={q.error} />
      ) : items.length === 0 ? (
        <EmptyState title={group === 0 ? "No history yet" : "Nothing of this kind yet"}>
          Every mounting, reframing, condition check and move of this object is listed here, newest first.
        </EmptyState>
      ) : (
        <ol className="relative space-y-3 border-l border-stone pl-5" data-testid="timeline">
          {items.map((e) => {
            const link = eventLink(e);
            return (
              <li key={e.seq} className="relative">
                <span aria-hidden="true" className="absolute -left-[1.6rem] top-1.5 h-2.5 w-2.5 rounded-full border-2 border-paper-sheet bg-accent" />
                <p className="text-xs text-graphite">
                  <span className="font-semibold text-ink-soft">{EVENT_TYPE_LABELS[e.type]}</span> · <time dateTime={e.occurredOn}>{formatDate(e.occurredOn)}</time> · {e.actorName}
                  {e.at.slice(0, 10) !== e.occurredOn && <span> · entered {formatDateTime(e.at)}</span>}
                </p>
                <p className="text-sm">{e.summary}</p>
                {Array.isArray(e.data.changes) && e.data.changes.length > 0 && (
                  <details className="mt-1 text-xs text-graphite">
                    <summary className="cursor-pointer">What changed ({(e.data.changes as unknown[]).length})</summary>
                    <ul className="mt-1 space-y-0.5">
                      {(e.data.changes as { path: string; before: unknown; after: unknown }[]).map((c) => (
                        <li key={c.path}>
                          <span className="font-medium">{c.path}</span>: {JSON.stringify(c.before)} → {JSON.stringify(c.after)}
                        </li>
                      ))}
                    </ul>
                  </details>
                )}
                {link && (
                  <Link to={link.to} className="text-xs font-medium text-accent hover:underline">
                    {link.label}
                  </Link>
                )}
              </li>
            );
          })}
        </ol>
      )}
      {q.hasNextPage && (
        <Button variant="secondary" onClick={() => q.fetchNextPage()} disabled={q.isFetchingNextPage}>
          {q.isFetchingNextPage ? "Loading…" : "Show older events"}
        </Button>
      )}
    </div>
  );
}

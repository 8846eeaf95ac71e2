import { Link, useSearchParams } from "react-router";
import { studioToday } from "@/lib/today.ts";
import { CONDITION_CONTEXTS, CONDITION_CONTEXT_LABELS, RATINGS, RATING_LABELS } from "@shared/schemas/condition.ts";
import { useConditionRegister } from "@/features/condition/api/condition.ts";
import { RatingBadge } from "@/features/condition/components/report-view.tsx";
import { FilterSelect } from "@/components/ui/field.tsx";
import { EmptyState, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { Pagination } from "@/components/ui/pagination.tsx";
import { formatDate } from "@/lib/format.ts";

/** Condition: every report across objects, with what is unresolved and what is due. */
export function Component() {
  const [params, setParams] = useSearchParams();
  const get = (k: string) => params.get(k) ?? undefined;
  const page = Number(params.get("page") ?? 1) || 1;
  const q = useConditionRegister({ rating: get("rating"), context: get("context"), from: get("from"), to: get("to"), examinerId: get("examiner"), unresolved: get("unresolved"), dueBy: get("due") ? studioToday() : undefined, page, pageSize: 50 });
  const set = (k: string, v: string | undefined) => setParams((p) => { const n = new URLSearchParams(p); v ? n.set(k, v) : n.delete(k); if (k !== "page") n.delete("page"); return n; }, { replace: true });

  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-2xl font-bold tracking-tight">Condition</h1>
        <p className="text-sm text-graphite">Every condition report, newest first. Findings are observations, not treatment: refer treatment to a qualified conservator.</p>
      </header>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <FilterSelect aria-label="Rating" value={get("rating") ?? ""} onChange={(e) => set("rating", e.target.value || undefined)}>
          <option value="">Any rating</option>
          {RATINGS.map((r) => <option key={r} value={r}>{RATING_LABELS[r]}</option>)}
        </FilterSelect>
        <FilterSelect aria-label="Context" value={get("context") ?? ""} onChange={(e) => set("context", e.target.value || undefined)}>
          <option value="">Any context</option>
          {CONDITION_CONTEXTS.map((c) => <option key={c} value={c}>{CONDITION_CONTEXT_LABELS[c]}</option>)}
        </FilterSelect>
        <FilterSelect aria-label="Examiner" value={get("examiner") ?? ""} onChange={(e) => set("examiner", e.target.value || undefined)}>
          <option value="">Any examiner</option>
          {q.data?.examiners.map((x) => <option key={x.id} value={x.id}>{x.name}</option>)}
        </FilterSelect>
        <label className="flex items-center gap-1">From <input type="date" aria-label="From" className="rounded-card border border-stone bg-paper-sheet px-2 py-1.5" value={get("from") ?? ""} onChange={(e) => set("from", e.target.value || undefined)} /></label>
        <label className="flex items-center gap-1">to <input type="date" aria-label="To" className="rounded-card border border-stone bg-paper-sheet px-2 py-1.5" value={get("to") ?? ""} onChange={(e) => set("to", e.target.value || undefined)} /></label>
        <label className="flex items-center gap-2"><input type="checkbox" checked={get("unresolved") === "true"} onChange={(e) => set("unresolved", e.target.checked ? "true" : undefined)} /> Unresolved findings</label>
        <label className="flex items-center gap-2"><input type="checkbox" checked={!!get("due")} onChange={(e) => set("due", e.target.checked ? "1" : undefined)} /> Check due</label>
      </div>
      <section className="rounded-card bg-paper-sheet shadow-card" aria-label="Condition reports">
        {q.isPending ? <SkeletonRows /> : q.isError ? <div className="p-4"><Notice tone="fail">{q.error.message}</Notice></div> : q.data.items.length === 0 ? (
          <div className="p-4"><EmptyState title="No condition reports match">Reports are written from an object's page, on arrival, before and after mounting, and at every hand-over.</EmptyState></div>
        ) : (
          <>
            <div className="overflow-x-auto">
              <table className="w-full text-sm">
                <thead className="border-b border-stone text-left text-ink-soft">
                  <tr>
                    {["Date", "Object number", "Title", "Context", "Rating", "Unresolved", "Examiner", "Check due", "Status"].map((h) => <th key={h} scope="col" className={`whitespace-nowrap px-3 py-2.5 font-semibold ${h === "Unresolved" ? "text-right" : ""}`}>{h}</th>)}
                  </tr>
                </thead>
                <tbody>
                  {q.data.items.map((r) => (
                    <tr key={r.id} className="border-b border-stone-light hover:bg-paper-deep/60">
                      <td className="whitespace-nowrap px-3 py-3 num"><Link className="text-accent hover:underline" to={`/condition/${r.id}`}>{formatDate(r.reportDate)}</Link></td>
                      <td className="whitespace-nowrap px-3 py-3 font-semibold num"><Link className="text-accent hover:underline" to={`/objects/${r.objectId}`}>{r.objectNumber}</Link></td>
                      <td className="px-3 py-3">{r.objectTitle}</td>
                      <td className="px-3 py-3 text-ink-soft">{CONDITION_CONTEXT_LABELS[r.context]}</td>
                      <td className="px-3 py-3"><RatingBadge rating={r.rating} /></td>
                      <td className="px-3 py-3 text-right num">{r.unresolvedCount}</td>
                      <td className="px-3 py-3 text-ink-soft">{r.examinerName}</td>
                      <td className="whitespace-nowrap px-3 py-3 num">{formatDate(r.checkDueOn)}</td>
                      <td className="px-3 py-3 text-ink-soft">{r.status === "signed" ? "Signed" : "Draft"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            <Pagination page={page} pageSize={50} total={q.data.total} onPage={(p) => set("page", String(p))} />
          </>
        )}
      </section>
    </div>
  );
}

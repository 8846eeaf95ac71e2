import type { Check, Finding, Verdict } from "@shared/schemas/mount-plan.ts";

export const VERDICT: Record<Verdict, { mark: string; word: string; cls: string }> = {
  pass: { mark: "✓", word: "Pass", cls: "bg-pass-soft text-pass" },
  warn: { mark: "▲", word: "Check", cls: "bg-warn-soft text-warn" },
  fail: { mark: "✕", word: "Fail", cls: "bg-fail-soft text-fail" },
};
const SEVERITY = { info: { mark: "●", cls: "text-graphite" }, warn: { mark: "▲", cls: "text-warn" }, error: { mark: "✕", cls: "text-fail" } } as const;

export function LevelBadge({ level }: { level: Verdict }) {
  return (
    <p className={`inline-flex items-center gap-2 rounded-card px-3 py-1.5 text-sm font-semibold ${VERDICT[level].cls}`} data-testid="plan-level">
      <span aria-hidden="true">{VERDICT[level].mark}</span>
      {level === "pass" ? "Conservation checks pass" : level === "warn" ? "Some checks need a decision" : "A conservation check fails"}
    </p>
  );
}

/** The conservation checks: a verdict with its word and shape, the rule, the reason and the source. */
export function ChecksList({ checks, showSources = true }: { checks: Check[]; showSources?: boolean }) {
  return (
    <>
      <ul className="divide-y divide-stone-light" data-testid="plan-checks">
        {checks.map((c) => (
          <li key={c.id} className="flex gap-3 py-2 print:py-0.5">
            <span
              className={`mt-0.5 inline-flex h-6 min-w-14 items-center justify-center gap-1 rounded px-1.5 text-xs font-semibold print:h-4 print:text-[9px] ${VERDICT[c.verdict].cls}`}
            >
              <span aria-hidden="true">{VERDICT[c.verdict].mark}</span>
              {VERDICT[c.verdict].word}
            </span>
            <div>
              <p className="font-medium">{c.rule}</p>
              <p className="text-ink-soft">{c.reason}</p>
              {showSources && <p className="mt-0.5 text-xs text-graphite print:hidden">Source: {c.source}</p>}
            </div>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-xs text-graphite print:mt-1 print:text-[9px]">
        These checks are planning aids, not conservation treatment advice; for a damaged or unstable object, consult a qualified conservator.
      </p>
    </>
  );
}

export function FindingsList({ findings }: { findings: Finding[] }) {
  if (findings.length === 0) return <p className="text-graphite">Nothing to report.</p>;
  return (
    <ul className="space-y-1.5" data-testid="plan-findings">
      {findings.map((f, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: the findings are recomputed as a whole on each change; position is their identity
        <li key={i} className="flex gap-2">
          <span aria-hidden="true" className={SEVERITY[f.severity].cls}>
            {SEVERITY[f.severity].mark}
          </span>
          <span>
            <span className="sr-only">{f.severity}: </span>
            {f.message}
          </span>
        </li>
      ))}
    </ul>
  );
}

import type { ReactNode } from "react";

type Tone = "info" | "pass" | "warn" | "fail";
const TONES: Record<Tone, { box: string; mark: string; word: string }> = {
  info: { box: "border-stone bg-paper-sheet text-ink", mark: "●", word: "Note" },
  pass: { box: "border-pass/40 bg-pass-soft text-pass", mark: "✓", word: "Done" },
  warn: { box: "border-warn/40 bg-warn-soft text-warn", mark: "▲", word: "Caution" },
  fail: { box: "border-fail/40 bg-fail-soft text-fail", mark: "✕", word: "Problem" },
};

/** A message box; the tone is carried by a mark and a word as well as colour. */
export function Notice({ tone = "info", title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  const t = TONES[tone];
  return (
    <div role={tone === "fail" ? "alert" : "status"} className={`flex gap-3 rounded-card border px-4 py-3 text-sm ${t.box}`}>
      <span aria-hidden="true" className="mt-0.5 font-bold">
        {t.mark}
      </span>
      <div>
        <p className="font-semibold">{title ?? t.word}</p>
        {children && <div className="mt-0.5 text-ink-soft">{children}</div>}
      </div>
    </div>
  );
}

/** A failure: its title (or "Problem") and the error's message. */
export function ErrorNotice({ title, error }: { title?: string; error: { message: string } | null | undefined }) {
  return (
    <Notice tone="fail" title={title}>
      {error?.message}
    </Notice>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-card border border-dashed border-stone bg-paper-sheet px-6 py-10 text-center">
      <p className="font-semibold text-ink">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-prose text-sm text-graphite">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}

export function Skeleton({ className = "" }: { className?: string }) {
  return <div aria-hidden="true" className={`animate-pulse rounded bg-stone-light ${className}`} />;
}

export function SkeletonRows({ rows = 8 }: { rows?: number }) {
  return (
    <div className="space-y-3 p-4" aria-label="Loading" role="status">
      {Array.from({ length: rows }, (_, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: placeholder rows with nothing but their position
        <Skeleton key={i} className="h-6 w-full" />
      ))}
    </div>
  );
}

export function Card({ title, actions, children, className = "" }: { title?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-card bg-paper-sheet shadow-card ${className}`}>
      {(title || actions) && (
        <header className="flex items-center justify-between gap-4 border-b border-stone-light px-5 py-3">
          {title && <h2 className="text-base font-semibold">{title}</h2>}
          {actions}
        </header>
      )}
      <div className="px-5 py-4">{children}</div>
    </section>
  );
}

export function Badge({ children, tone = "neutral" }: { children: ReactNode; tone?: "neutral" | "accent" | "warn" }) {
  const cls = tone === "accent" ? "bg-accent-soft text-accent" : tone === "warn" ? "bg-warn-soft text-warn" : "bg-stone-light text-ink-soft";
  return <span className={`inline-block rounded-full px-2 py-0.5 text-xs font-medium ${cls}`}>{children}</span>;
}

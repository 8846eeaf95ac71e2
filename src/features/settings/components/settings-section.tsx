import type { ReactNode } from "react";

/** One card of the studio page, named by its heading (the section's accessible name is the heading's text). */
export function SettingsSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="max-w-3xl space-y-3 rounded-card bg-paper-sheet p-5 shadow-card" aria-label={title}>
      <h2 className="text-base font-semibold">{title}</h2>
      {children}
    </section>
  );
}

import type { ReactNode } from "react";
import { ErrorNotice, SkeletonRows } from "./feedback.tsx";

/** A page's title, its one-line purpose, and its actions on the right. */
export function PageHeader({ title, intro, actions, gap = "gap-4" }: { title: ReactNode; intro?: ReactNode; actions?: ReactNode; gap?: "gap-3" | "gap-4" }) {
  return (
    <header className={`flex flex-wrap items-end justify-between ${gap}`}>
      <div>
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        {intro && <p className="text-sm text-graphite">{intro}</p>}
      </div>
      {actions}
    </header>
  );
}

/** The usual `isEmpty` of a paged list: no items on this page. */
export const noItems = (page: { items: readonly unknown[] }) => page.items.length === 0;

type Query<T> = { isPending: boolean; isError: boolean; error: Error | null; data: T | undefined };

/** What a list shows while it loads, when it fails, when it is empty, and otherwise its rows. */
export function QueryView<T>({
  query,
  rows,
  errorTitle,
  isEmpty,
  empty,
  padded = false,
  children,
}: {
  query: Query<T>;
  /** Skeleton rows while loading. */
  rows?: number;
  errorTitle?: string;
  isEmpty: (data: T) => boolean;
  empty: ReactNode;
  /** Messages inside a bare card need its padding. */
  padded?: boolean;
  children: (data: T) => ReactNode;
}) {
  const pad = (node: ReactNode) => (padded ? <div className="p-4">{node}</div> : node);
  if (query.isPending) return <SkeletonRows rows={rows} />;
  if (query.isError || query.data === undefined) return pad(<ErrorNotice title={errorTitle} error={query.error} />);
  if (isEmpty(query.data)) return pad(empty);
  return <>{children(query.data)}</>;
}

/** A list page's card: the list's states inside, busy while it fetches again. */
export function ListSection<T>({ label, busy, ...view }: { label: string; busy?: boolean } & Parameters<typeof QueryView<T>>[0]) {
  return (
    <section aria-label={label} className="rounded-card bg-paper-sheet shadow-card" aria-busy={busy}>
      <QueryView padded {...view} />
    </section>
  );
}

export function Pagination({ page, pageSize, total, onPage }: { page: number; pageSize: number; total: number; onPage: (p: number) => void }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const from = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const to = Math.min(total, page * pageSize);
  return (
    <nav aria-label="Pages" className="flex items-center justify-between gap-4 px-3 py-3 text-sm text-graphite">
      <p className="num">
        {from.toLocaleString("en-GB")}–{to.toLocaleString("en-GB")} of {total.toLocaleString("en-GB")}
      </p>
      <div className="flex items-center gap-2">
        <button type="button" className="rounded-card border border-stone bg-paper-sheet px-3 py-1 disabled:opacity-50" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          ← Previous
        </button>
        <span className="num">
          Page {page} of {pages.toLocaleString("en-GB")}
        </span>
        <button type="button" className="rounded-card border border-stone bg-paper-sheet px-3 py-1 disabled:opacity-50" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          Next →
        </button>
      </div>
    </nav>
  );
}

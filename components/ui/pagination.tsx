"use client";

/** Previous / next through server pages, with where the reader is: "26–50 of 84". */
export function Pagination({
  page,
  pageSize,
  total,
  onPageChange,
  label = "Pages",
}: {
  page: number;
  pageSize: number;
  total: number;
  onPageChange: (page: number) => void;
  label?: string;
}) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label={label} className="flex flex-wrap items-center justify-between gap-3 border-t border-chart-rule px-4 py-3 text-sm">
      <p className="text-chart-muted" aria-live="polite">
        {total === 0 ? "Nothing to show" : `${first}–${last} of ${total}`}
      </p>
      {pageCount > 1 ? (
        <div className="flex items-center gap-2">
          <button type="button" className="btn-quiet px-3 py-1" disabled={page <= 1} onClick={() => onPageChange(page - 1)}>
            <span aria-hidden>←</span> Previous
          </button>
          <span className="font-mono text-xs text-chart-muted">
            page {Math.min(page, pageCount)} / {pageCount}
          </span>
          <button type="button" className="btn-quiet px-3 py-1" disabled={page >= pageCount} onClick={() => onPageChange(page + 1)}>
            Next <span aria-hidden>→</span>
          </button>
        </div>
      ) : null}
    </nav>
  );
}

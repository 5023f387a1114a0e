"use client";

import { useState } from "react";

export const PAGE_SIZE = 25;

/** The page of a long list the table shows, and the buttons to move between pages. */
export function usePage<T>(items: T[], size = PAGE_SIZE) {
  const [page, setPage] = useState(0);
  const pages = Math.max(1, Math.ceil(items.length / size));
  const current = Math.min(page, pages - 1);
  return { rows: items.slice(current * size, (current + 1) * size), page: current, pages, setPage };
}

export function Pager({ label, page, pages, setPage }: { label: string; page: number; pages: number; setPage: (p: number) => void }) {
  if (pages <= 1) return null;
  return (
    <nav aria-label={label} className="flex items-center justify-end gap-2 border-t border-line px-3 py-2 text-sm">
      <button type="button" className="btn-quiet py-1" onClick={() => setPage(page - 1)} disabled={page === 0}>
        Previous
      </button>
      <span aria-live="polite">
        Page {page + 1} of {pages}
      </span>
      <button type="button" className="btn-quiet py-1" onClick={() => setPage(page + 1)} disabled={page >= pages - 1}>
        Next
      </button>
    </nav>
  );
}

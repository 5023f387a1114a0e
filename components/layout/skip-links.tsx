"use client";

import { usePathname } from "next/navigation";
import type { MouseEvent } from "react";

export const MAIN_ID = "main-content";
export const RANKED_TABLE_ID = "ranked-trains";

// A sweep's own page (not its builder, not a candidate) holds the ranked table.
const SWEEP_PAGE = /^\/projects\/[^/]+\/sweeps\/(?!new$)[^/]+$/;

/** Moves the keyboard focus to the target itself, so the next Tab starts from there. */
function jump(e: MouseEvent<HTMLAnchorElement>, id: string) {
  const target = document.getElementById(id) ?? document.getElementById(MAIN_ID);
  if (!target) return;
  e.preventDefault();
  if (!target.hasAttribute("tabindex")) target.setAttribute("tabindex", "-1");
  target.focus();
  target.scrollIntoView({ block: "start" });
}

/** The first stops of every page: past the header to the page's content, and on a sweep to its ranked table. */
export function SkipLinks() {
  const path = usePathname();
  return (
    <nav aria-label="Skip links">
      <a href={`#${MAIN_ID}`} className="skip-link" onClick={(e) => jump(e, MAIN_ID)}>
        Skip to main content
      </a>
      {SWEEP_PAGE.test(path ?? "") ? (
        <a href={`#${RANKED_TABLE_ID}`} className="skip-link" onClick={(e) => jump(e, RANKED_TABLE_ID)}>
          Skip to the ranked table
        </a>
      ) : null}
    </nav>
  );
}

"use client";

import { buttonClass } from "@/components/ui/styles";

/** The browser's own print dialog; the page's print styles leave only the report on paper. */
export function PrintButton() {
  return (
    <button type="button" className={buttonClass("secondary")} onClick={() => window.print()}>
      Print
    </button>
  );
}

/** Class lists shared by controls, so every form looks and behaves the same. */

const buttonBase =
  "inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const buttonVariants = {
  primary: "bg-accent text-white hover:bg-accent-strong",
  secondary:
    "border border-slate-300 bg-white text-ink hover:bg-slate-100 dark:border-slate-600 dark:bg-slate-900 dark:text-slate-100 dark:hover:bg-slate-800",
  danger: "border border-red-300 bg-white text-critical hover:bg-red-50 dark:border-red-800 dark:bg-slate-900 dark:hover:bg-red-950",
} as const;

export type ButtonVariant = keyof typeof buttonVariants;

export function buttonClass(variant: ButtonVariant = "primary"): string {
  return `${buttonBase} ${buttonVariants[variant]}`;
}

export const inputClass =
  "block w-full rounded-md border border-slate-300 bg-white px-3 py-2 text-base text-ink shadow-sm placeholder:text-slate-400 focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30 aria-[invalid=true]:border-critical sm:text-sm dark:border-slate-600 dark:bg-slate-900 dark:text-slate-100";

// min-w-0: a card in a grid must not grow to its widest table; the table scrolls inside it instead.
export const cardClass =
  "min-w-0 rounded-lg border border-slate-200 bg-white shadow-sm dark:border-slate-800 dark:bg-slate-900";

export const tableClass = "min-w-full divide-y divide-slate-200 text-sm dark:divide-slate-800";
// No uppercase: it would turn the unit µε into "ΜΕ".
export const thClass = "px-3 py-2 text-left text-xs font-semibold text-slate-500 dark:text-slate-400";
export const tdClass = "px-3 py-2 align-middle";

/**
 * A table that turns into stacked cards on a phone: each row a block, each cell a line headed by
 * its column name (the cell's `data-label`), so nothing scrolls sideways at 390 px.
 */
export const stackedTable = {
  table: `${tableClass} max-sm:block`,
  head: "max-sm:sr-only",
  body: "divide-y divide-slate-100 max-sm:block dark:divide-slate-800",
  row: "max-sm:block max-sm:py-2",
  cell: `${tdClass} max-sm:block max-sm:py-1 max-sm:before:block max-sm:before:text-xs max-sm:before:font-semibold max-sm:before:text-slate-500 max-sm:before:content-[attr(data-label)]`,
} as const;

/** Passed or Failed in words, with a shape and a colour of its own, so no one reading has to rely on colour. */
export function ShuntVerdict({ passed }: { passed: boolean }) {
  return passed ? (
    <span data-testid="shunt-verdict" className="inline-flex items-center gap-1 rounded-full bg-emerald-100 px-2.5 py-0.5 text-sm font-semibold text-emerald-900 dark:bg-emerald-950 dark:text-emerald-200">
      <span aria-hidden>✓</span> Passed
    </span>
  ) : (
    <span data-testid="shunt-verdict" className="inline-flex items-center gap-1 rounded-md border-2 border-critical bg-red-50 px-2.5 py-0.5 text-sm font-semibold text-critical dark:bg-red-950/50 dark:text-red-200">
      <span aria-hidden>✕</span> Failed
    </span>
  );
}

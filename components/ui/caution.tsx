import { CONCRETE_CAUTION } from "@/lib/mechanics";

/** The cautions every screen with results on it carries (linear elasticity, reference state, local codes); `children` adds a screen's own items first. */
export function MonitoringCaution({ children }: { children?: React.ReactNode }) {
  return (
    <aside
      aria-label="Caution"
      className="rounded-md border border-amber-300 bg-amber-50 px-4 py-3 text-sm text-amber-950 dark:border-amber-700 dark:bg-amber-950/40 dark:text-amber-100"
    >
      <p className="font-semibold">Read with care</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {children}
        <li>Monitoring supplements inspection; it never replaces it.</li>
        <li>
          Limits and what they mean are the responsibility of a licensed engineer under local codes; the
          product&apos;s defaults are examples only.
        </li>
        <li>Alerts can be delayed by logger, network or mail failures: check when data last arrived.</li>
      </ul>
    </aside>
  );
}

/** The item a screen adds to its cautions when it shows a concrete gauge's utilisation. */
export function ConcreteCaution() {
  return <li data-testid="concrete-caution">{CONCRETE_CAUTION}</li>;
}

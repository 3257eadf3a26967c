import Link from "next/link";
import type { UserActor } from "@/lib/auth/actor";
import { listSiteVisits } from "@/lib/services/site-visits";
import { EmptyState } from "@/components/ui/empty-state";
import { SiteVisitList } from "./site-visit-list";

/** The newest site visits that name a gauge, linking to the structure's whole log. */
export async function GaugeVisitsSection({ user, code, tag, timeZone }: { user: UserActor; code: string; tag: string; timeZone: string }) {
  const { visits, total } = await listSiteVisits(user, code, { gauge: tag });
  return (
    <section className="space-y-3" aria-labelledby="gauge-visits-heading">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="gauge-visits-heading" className="text-lg font-semibold">
          Site visits that name this gauge
        </h2>
        <Link href={`/structures/${encodeURIComponent(code)}/site-visits`} className="text-sm font-medium text-accent underline">
          All site visits
        </Link>
      </div>
      {total === 0 ? (
        <EmptyState title={`No site visit names ${tag} yet`}>A visit that touches the gauge lists it, and shows here.</EmptyState>
      ) : (
        <>
          <SiteVisitList code={code} timeZone={timeZone} visits={visits} />
          {total > visits.length && (
            <p className="text-sm text-slate-600 dark:text-slate-400">
              The {visits.length} newest of {total.toLocaleString("en-US")} visits that name {tag}.
            </p>
          )}
        </>
      )}
    </section>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { SiteVisitForm } from "@/components/field-records/site-visit-form";
import { SiteVisitList } from "@/components/field-records/site-visit-list";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Pager } from "@/components/ui/pager";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listGauges } from "@/lib/services/gauges";
import { listSiteVisits } from "@/lib/services/site-visits";
import { getVisibleStructure } from "@/lib/services/structures";
import { axisText, dayOf } from "@/lib/time-format";

type Props = { params: Promise<{ code: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Site visits · ${(await params).code}` };
}

/** ?page= as a page number; anything else reads as the first page. */
const pageOf = (value: unknown) => (typeof value === "string" && /^[1-9]\d{0,5}$/.test(value) ? Number(value) : 1);

/** Now on the structure's clock, as a date-and-time field shows it ("2026-07-01T13:00"): the form's default. */
function clockNow(zone: string): string {
  const now = Date.now();
  return `${dayOf(now, zone)}T${axisText(now, zone, "minute")}`;
}

/** The structure's site-visit log, newest first, and for technicians and engineers the form that records a visit. */
export default async function SiteVisitsPage({ params, searchParams }: Props) {
  const { code } = await params;
  const page = pageOf((await searchParams).page);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [visits, canAdd] = await Promise.all([listSiteVisits(user, code, { page }), may(user, "field-record:add", structure)]);
  const gauges = canAdd ? (await listGauges(user, code)).filter((gauge) => gauge.status === "active") : [];
  const zone = structure.timezone;
  return (
    <div className="space-y-8">
      <PageHeader
        title={`Site visits: ${structure.name}`}
        subtitle={
          <>
            Who went, when, what was done · times in {zone}
            <Link href={`/structures/${encodeURIComponent(structure.code)}`} className="ml-2 text-accent underline">
              Structure page
            </Link>
          </>
        }
      />
      {canAdd && (
        <section aria-labelledby="add-visit-heading" className="space-y-3">
          <h2 id="add-visit-heading" className="text-lg font-semibold">
            Record a visit
          </h2>
          <SiteVisitForm code={structure.code} timeZone={zone} gauges={gauges.map((gauge) => ({ tag: gauge.tag, label: gauge.label ?? null }))} visitor={user.name} now={clockNow(zone)} />
        </section>
      )}
      <section aria-labelledby="visits-heading" className="space-y-3">
        <h2 id="visits-heading" className="text-lg font-semibold">
          Visits, newest first
        </h2>
        {visits.total === 0 ? (
          <EmptyState title="No site visits recorded yet">
            Each visit records who went, when, what was done, the gauges touched and photos, so whoever reads the data later knows what happened on site.{" "}
            {canAdd ? "Record one with the form above." : "Technicians and engineers record them."}
          </EmptyState>
        ) : visits.visits.length === 0 ? (
          <EmptyState title={`There is no page ${page}`}>
            <Link href="?page=1" className="text-accent underline">
              Go to the newest visits
            </Link>
          </EmptyState>
        ) : (
          <SiteVisitList code={structure.code} timeZone={zone} visits={visits.visits} />
        )}
        <Pager total={visits.total} page={page} perPage={visits.perPage} query={{}} noun="visits" />
      </section>
    </div>
  );
}

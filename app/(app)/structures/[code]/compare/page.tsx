import type { Metadata } from "next";
import Link from "next/link";
import { CompareChart } from "@/components/charts/compare-chart";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { gaugeStatuses } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";

export const metadata: Metadata = { title: "Compare gauges" };

type Props = { params: Promise<{ code: string }>; searchParams: Promise<{ gauges?: string }> };

export default async function ComparePage({ params, searchParams }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const statuses = (await gaugeStatuses(structure)).filter((status) => !status.retired);
  const requested = ((await searchParams).gauges ?? "").split(",").filter((tag) => statuses.some((s) => s.tag === tag));
  // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
  const end = Math.max(0, ...statuses.map((status) => status.latest?.time ?? 0)) || Date.now();
  return (
    <>
      <PageHeader
        title="Compare gauges"
        subtitle={
          <Link href={`/structures/${code}`} className="text-accent underline">
            {structure.name}
          </Link>
        }
      />
      <CompareChart structureCode={code} tags={requested.length ? requested : statuses.slice(0, 3).map((s) => s.tag)} allTags={statuses.map((s) => s.tag)} end={end} timeZone={structure.timezone} />
      <div className="mt-6">
        <MonitoringCaution />
      </div>
    </>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RosetteCharts } from "@/components/charts/rosette-charts";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listRosettes } from "@/lib/services/rosettes";
import { gaugeStatuses } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Rosette" };

export default async function RosettePage({ params }: Props) {
  const { code, tag: rawTag } = await params;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const rosette = (await listRosettes(user, code)).find((candidate) => candidate.tag === tag);
  if (!rosette) notFound();
  const statuses = await gaugeStatuses(structure);
  const end = Math.max(0, ...statuses.filter((s) => rosette.gauges.includes(s.tag)).map((s) => s.latest?.time ?? 0)) || Date.now();
  return (
    <>
      <PageHeader
        title={`Rosette ${rosette.tag}`}
        subtitle={
          <>
            <Link href={`/structures/${code}`} className="text-accent underline">
              {structure.name}
            </Link>{" "}
            · {rosette.layout} ({rosette.layout === "rectangular" ? "0°/45°/90°" : "0°/60°/120°"}) · gauges {rosette.gauges.join(", ")} · plane stress, material of gauge{" "}
            {rosette.gauges[0]}
          </>
        }
      />
      <RosetteCharts structureCode={code} tag={tag} end={end} timeZone={structure.timezone} />
      <div className="mt-6">
        <MonitoringCaution>
          <li>Principal stresses assume plane stress in a linear elastic material at the rosette; near welds and holes local stresses may differ.</li>
        </MonitoringCaution>
      </div>
    </>
  );
}

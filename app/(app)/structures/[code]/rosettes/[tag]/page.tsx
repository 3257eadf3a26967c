import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RosetteCharts } from "@/components/charts/rosette-charts";
import { LimitsEditor } from "@/components/limits/limits-editor";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getRosetteLimits } from "@/lib/services/rosette-limits";
import { listRosettes } from "@/lib/services/rosettes";
import { latestReadingOf } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";
import { saveRosetteLimitsAction } from "../../gauges/actions";

/** A rosette's limits bound its derived stresses, all in MPa. */
const ROSETTE_QUANTITY_UNITS = { vonMises: "MPa", sigma1: "MPa", sigma2: "MPa" };

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Rosette" };

export default async function RosettePage({ params }: Props) {
  const { code, tag: rawTag } = await params;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const rosette = (await listRosettes(user, code)).find((candidate) => candidate.tag === tag);
  if (!rosette) notFound();
  // The charts end at the rosette's own last reading: its three gauges, not every gauge of the structure.
  const [latest, limits, canEdit] = await Promise.all([
    Promise.all(rosette.gauges.map((gauge) => latestReadingOf(user, code, gauge))),
    pageGuard(getRosetteLimits(user, code, tag)),
    may(user, "limits:edit", structure),
  ]);
  // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
  const end = Math.max(0, ...latest.map((reading) => reading?.time ?? 0)) || Date.now();
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
      <RosetteCharts structureCode={code} tag={tag} end={end} timeZone={structure.timezone} limits={limits} />
      <section className="mt-6" aria-labelledby="rosette-limits">
        <h2 id="rosette-limits" className="mb-2 text-lg font-semibold">
          Limits
        </h2>
        <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">
          {canEdit ? "Set by the monitoring engineer." : "Only engineers change limits."} Checked on ingest at the instants all three gauges have a reading,
          including instants completed late (up to three days); an instant with a faulty gauge reading is skipped.
        </p>
        <LimitsEditor
          structureCode={code}
          tag={tag}
          timeZone={structure.timezone}
          initial={limits}
          canEdit={canEdit}
          save={saveRosetteLimitsAction.bind(null, code, tag)}
          quantities={ROSETTE_QUANTITY_UNITS}
          unitsNote="Bounds are stresses, in the units you chose: von Mises stress, and the principal stresses σ₁ (the larger) and σ₂."
          rosette={{ end }}
        />
      </section>
      <div className="mt-6">
        <MonitoringCaution>
          <li>Principal stresses assume plane stress in a linear elastic material at the rosette; near welds and holes local stresses may differ.</li>
        </MonitoringCaution>
      </div>
    </>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { FatigueView } from "@/components/fatigue/fatigue-view";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getGauge } from "@/lib/services/gauges";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string; tag: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { code, tag } = await params;
  return { title: `Fatigue · ${decodeURIComponent(tag)} · ${code}` };
}

/** A gauge's fatigue damage and implied life for a chosen period; the figures come from the API in the browser. */
export default async function GaugeFatiguePage({ params }: Props) {
  const { code, tag: rawTag } = await params;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const [structure, gauge] = await pageGuard(Promise.all([getVisibleStructure(user, code), getGauge(user, code, tag)]));
  const gaugePath = `/structures/${code}/gauges/${encodeURIComponent(tag)}`;
  return (
    <>
      <PageHeader
        title={`Fatigue of gauge ${gauge.tag}`}
        subtitle={
          <>
            {[gauge.label, gauge.member].filter(Boolean).join(" · ") || "No location recorded"} ·{" "}
            <Link href={gaugePath} className="text-accent underline">
              Gauge page
            </Link>
          </>
        }
      />
      <FatigueView apiPath={`/api/v1${gaugePath}/fatigue`} gaugeCategory={gauge.detailCategory} timeZone={structure.timezone} />
      <div className="mt-6">
        <MonitoringCaution>
          <li>
            Damage and life are an estimate that depends on the detail category the engineer chose: one category lower shortens the life by
            30 % or more.
          </li>
          <li>
            The S-N curve applies to nominal stress ranges at the detail; a gauge away from the detail measures another stress, and the
            rate assumes the period observed stands for the years ahead.
          </li>
        </MonitoringCaution>
      </div>
    </>
  );
}

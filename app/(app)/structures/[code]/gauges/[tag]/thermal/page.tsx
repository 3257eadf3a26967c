import type { Metadata } from "next";
import Link from "next/link";
import { ThermalModelEditor } from "@/components/thermal/thermal-model-editor";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { findThermalModel } from "@/lib/services/thermal";
import { latestReadingOf } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Thermal model" };

export default async function ThermalModelPage({ params }: Props) {
  const { code, tag: rawTag } = await params;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [current, canEdit, latest] = await Promise.all([pageGuard(findThermalModel(user, code, tag)), may(user, "thermal-model:edit", structure), latestReadingOf(user, code, tag)]);
  const range = current ? `${current.temperatureRange.min.toFixed(1)} to ${current.temperatureRange.max.toFixed(1)} °C` : "the reference period's temperatures";
  return (
    <>
      <PageHeader
        title={`Thermal model of ${tag}`}
        subtitle={
          <>
            <Link className="text-accent underline" href={`/structures/${code}/gauges/${encodeURIComponent(tag)}`}>
              Back to the gauge
            </Link>{" "}
            · The residual (measured − model, µε) is charted on the gauge page with a ±2σ band and can be given limits.
          </>
        }
      />
      <div className="mb-6">
        <MonitoringCaution>
          <li>
            A thermal model is a statistical fit, valid only inside the reference period&apos;s temperature range ({range}) and while the structure behaves
            as it did then. A residual outside ±2σ says the gauge departs from its past thermal response, not why: tell loading, creep, a sensor fault and a
            real change apart by engineering judgement.
          </li>
          <li>A new zero moves the strain the model was fitted to: fit again after re-zeroing.</li>
        </MonitoringCaution>
      </div>
      <ThermalModelEditor structureCode={code} tag={tag} timeZone={structure.timezone} current={current} canEdit={canEdit}
        // eslint-disable-next-line react-hooks/purity -- a server component renders once per request: now is that request's time
        end={latest?.time ?? Date.now()}
      />
    </>
  );
}

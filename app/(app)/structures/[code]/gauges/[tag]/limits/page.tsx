import type { Metadata } from "next";
import Link from "next/link";
import { LimitsEditor } from "@/components/limits/limits-editor";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getLimits } from "@/lib/services/limits";
import { getGauge } from "@/lib/services/gauges";
import { latestReadingOf } from "@/lib/services/status";
import { getVisibleStructure } from "@/lib/services/structures";
import { saveLimitsAction } from "../../actions";

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Limits" };

export default async function LimitsPage({ params }: Props) {
  const { code, tag: rawTag } = await params;
  const tag = decodeURIComponent(rawTag);
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [limits, canEdit, gauge, latest] = await Promise.all([
    pageGuard(getLimits(user, code, tag)),
    may(user, "limits:edit", structure),
    pageGuard(getGauge(user, code, tag)),
    latestReadingOf(user, code, tag),
  ]);
  const lastReading = latest?.time ?? null;
  return (
    <>
      <PageHeader
        title={`Limits of ${tag}`}
        subtitle={
          <>
            <Link className="text-accent underline" href={`/structures/${code}/gauges/${encodeURIComponent(tag)}`}>
              Back to the gauge
            </Link>{" "}
            · {canEdit ? "Set by the monitoring engineer." : "Only engineers change limits."}
          </>
        }
      />
      <div className="mb-6">
        <MonitoringCaution />
      </div>
      <LimitsEditor
        structureCode={code}
        tag={tag}
        timeZone={structure.timezone}
        initial={limits}
        canEdit={canEdit}
        save={saveLimitsAction.bind(null, code, tag)}
        gauge={{ yieldStress: gauge.material.yield ?? null, lastReading }}
      />
    </>
  );
}

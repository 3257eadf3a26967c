import type { Metadata } from "next";
import { GaugeForm } from "@/components/gauges/gauge-form";
import { PageHeader } from "@/components/ui/page-header";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { formValuesOf } from "@/lib/gauges/form-values";
import { gaugeFieldsOf } from "@/lib/gauges/record";
import { resolveGauge } from "@/lib/services/gauges";
import { replaceGaugeAction } from "../../actions";

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Replace gauge" };

export default async function ReplaceGaugePage({ params }: Props) {
  const { code, tag } = await params;
  const user = await requireUser();
  const { structure, gauge } = await pageGuard(resolveGauge(user, code, decodeURIComponent(tag), "gauge:register"));
  // The new gauge starts as a copy of the old one at the same place; its own tag and zero must be entered.
  const { zero: _oldZero, ...sameAsBefore } = gaugeFieldsOf(gauge);
  const initial = formValuesOf({ ...sameAsBefore, tag: "" });
  return (
    <>
      <PageHeader
        title={`Replace gauge ${gauge.tag}`}
        subtitle={`${structure.name}. ${gauge.tag} is retired and the new gauge takes its place, linked to it, so the location's record stays continuous with the changeover marked.`}
      />
      <GaugeForm mode="replace" structureCode={code} timeZone={structure.timezone} initial={initial} submit={replaceGaugeAction.bind(null, code, gauge.tag)} />
    </>
  );
}

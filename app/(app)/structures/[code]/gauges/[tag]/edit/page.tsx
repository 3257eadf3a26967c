import type { Metadata } from "next";
import { GaugeForm } from "@/components/gauges/gauge-form";
import { PageHeader } from "@/components/ui/page-header";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { formValuesOf } from "@/lib/gauges/form-values";
import { gaugeFieldsOf } from "@/lib/gauges/record";
import { resolveGauge } from "@/lib/services/gauges";
import { editGaugeAction } from "../../actions";

type Props = { params: Promise<{ code: string; tag: string }> };

export const metadata: Metadata = { title: "Edit gauge" };

export default async function EditGaugePage({ params }: Props) {
  const { code, tag } = await params;
  const user = await requireUser();
  const { structure, gauge } = await pageGuard(resolveGauge(user, code, decodeURIComponent(tag), "gauge:register"));
  return (
    <>
      <PageHeader
        title={`Edit gauge ${gauge.tag}`}
        subtitle={`${structure.name}. Readings already stored keep the values they were converted with; the zero has its own form on the gauge page.`}
      />
      <GaugeForm mode="edit" structureCode={code} timeZone={structure.timezone} initial={formValuesOf(gaugeFieldsOf(gauge))} submit={editGaugeAction.bind(null, code, gauge.tag)} />
    </>
  );
}

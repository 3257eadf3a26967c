import type { Metadata } from "next";
import { GaugeForm } from "@/components/gauges/gauge-form";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { formValuesOf } from "@/lib/gauges/form-values";
import { MATERIALS } from "@/lib/mechanics";
import { getVisibleStructure } from "@/lib/services/structures";
import { registerGaugeAction } from "../actions";

export const metadata: Metadata = { title: "Register a gauge" };

export default async function NewGaugePage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  await pageGuard(requirePermission(user, "gauge:register", structure));
  const initial = formValuesOf({ expectedInterval: 600, material: { ...MATERIALS["structural-steel-eu"] } });
  return (
    <>
      <PageHeader title="Register a gauge" subtitle={`${structure.name} (${structure.code})`} />
      <GaugeForm mode="register" structureCode={code} timeZone={structure.timezone} initial={initial} submit={registerGaugeAction.bind(null, code)} />
    </>
  );
}

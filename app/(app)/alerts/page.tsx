import type { Metadata } from "next";
import { AlertFilters } from "@/components/alerts/alert-filters";
import { AlertTable } from "@/components/alerts/alert-table";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { Pager } from "@/components/ui/pager";
import { ALERTS_PER_PAGE, alertListParamsOf, pageOffset } from "@/lib/alerting/filters";
import { requireUser } from "@/lib/auth/session";
import { listAlertsAcross } from "@/lib/services/alerts";
import { listStructuresFor } from "@/lib/services/structures";
import { unitsOf } from "@/lib/services/users";

export const metadata: Metadata = { title: "Alerts" };

export default async function AlertsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requireUser();
  const { page, ...filter } = alertListParamsOf(await searchParams);
  const [list, structures, units] = await Promise.all([
    listAlertsAcross(user, { ...filter, limit: ALERTS_PER_PAGE, offset: pageOffset(page) }),
    listStructuresFor(user),
    unitsOf(user.id),
  ]);
  const timeZones = Object.fromEntries(structures.map((s) => [s.code, s.timezone]));
  return (
    <>
      <PageHeader title="Alerts" subtitle="Limit crossings and sensor faults on every structure you can see, newest first. Times are each structure's local time." />
      <AlertFilters {...filter} />
      <AlertTable alerts={list.alerts} timeZones={timeZones} units={units} />
      <Pager total={list.total} page={page} perPage={ALERTS_PER_PAGE} query={filter} noun="alerts" />
      <div className="mt-6">
        <MonitoringCaution />
      </div>
    </>
  );
}

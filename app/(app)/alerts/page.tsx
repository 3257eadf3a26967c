import type { Metadata } from "next";
import { AlertFilters } from "@/components/alerts/alert-filters";
import { AlertTable } from "@/components/alerts/alert-table";
import { MonitoringCaution } from "@/components/ui/caution";
import { PageHeader } from "@/components/ui/page-header";
import { alertFilterOf, matchesFilter } from "@/lib/alerting/filters";
import { requireUser } from "@/lib/auth/session";
import { listAlertsAcross } from "@/lib/services/alerts";
import { listStructuresFor } from "@/lib/services/structures";

export const metadata: Metadata = { title: "Alerts" };

export default async function AlertsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requireUser();
  const filter = alertFilterOf(await searchParams);
  const [alerts, structures] = await Promise.all([listAlertsAcross(user, filter.state), listStructuresFor(user)]);
  const timeZones = Object.fromEntries(structures.map((s) => [s.code, s.timezone]));
  return (
    <>
      <PageHeader title="Alerts" subtitle="Limit crossings and sensor faults on every structure you can see, newest first. Times are each structure's local time." />
      <AlertFilters {...filter} />
      <AlertTable alerts={alerts.filter((alert) => matchesFilter(alert, filter))} timeZones={timeZones} />
      <div className="mt-6">
        <MonitoringCaution />
      </div>
    </>
  );
}

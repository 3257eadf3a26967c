import type { Metadata } from "next";
import Link from "next/link";
import { LoadTestForm } from "@/components/load-tests/load-test-form";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { cardClass, stackedTable, thClass } from "@/components/ui/styles";
import { recordLoadTestAction } from "@/lib/actions/load-test-actions";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listGauges } from "@/lib/services/gauges";
import { listLoadTests } from "@/lib/services/load-tests";
import { getVisibleStructure } from "@/lib/services/structures";
import { formatInTimeZone } from "@/lib/time-format";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Load tests · ${(await params).code}` };
}

/** The structure's load tests, and for engineers the form that records one. */
export default async function LoadTestsPage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [tests, canRecord] = await Promise.all([listLoadTests(user, code), may(user, "load-test:record", structure)]);
  const gauges = canRecord ? (await listGauges(user, code)).filter((gauge) => gauge.status === "active") : [];
  const zone = structure.timezone;
  const base = `/structures/${encodeURIComponent(structure.code)}`;
  return (
    <div className="space-y-8">
      <PageHeader
        title={`Load tests: ${structure.name}`}
        subtitle={
          <>
            Measured against predicted strain per gauge · times in {zone}
            <Link href={base} className="ml-2 text-accent underline">
              Structure page
            </Link>
          </>
        }
      />
      <section aria-labelledby="tests-heading" className="space-y-3">
        <h2 id="tests-heading" className="text-lg font-semibold">
          Recorded tests
        </h2>
        {tests.length === 0 ? (
          <EmptyState title="No load tests yet">
            A load test records when a known load stood on the structure and the strain a model predicts for each gauge; Hookeline then sets the measured peak beside
            the prediction. {canRecord ? "Record one with the form below." : "An engineer records them."}
          </EmptyState>
        ) : (
          <div className={cardClass}>
            <table className={stackedTable.table}>
              <thead className={stackedTable.head}>
                <tr>
                  <th className={thClass}>Test</th>
                  <th className={thClass}>Window</th>
                  <th className={thClass}>Gauges</th>
                  <th className={thClass}>Recorded by</th>
                </tr>
              </thead>
              <tbody className={stackedTable.body}>
                {tests.map((test) => (
                  <tr key={test.id} className={stackedTable.row}>
                    <td className={stackedTable.cell} data-label="Test">
                      <Link href={`${base}/load-tests/${test.id}`} className="font-medium text-accent underline">
                        {test.title}
                      </Link>
                      <p className="text-xs text-slate-500">{test.load}</p>
                    </td>
                    <td className={stackedTable.cell} data-label="Window">
                      {formatInTimeZone(new Date(test.start), zone)} to {formatInTimeZone(new Date(test.end), zone)}
                    </td>
                    <td className={stackedTable.cell} data-label="Gauges">
                      {test.gauges}
                    </td>
                    <td className={stackedTable.cell} data-label="Recorded by">
                      {test.createdBy}, {formatInTimeZone(new Date(test.createdAt), zone)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      {canRecord && (
        <section aria-labelledby="record-heading" className="space-y-3">
          <h2 id="record-heading" className="text-lg font-semibold">
            Record a load test
          </h2>
          {gauges.length === 0 ? (
            <EmptyState title="No active gauges">Register gauges on the structure before recording a load test.</EmptyState>
          ) : (
            <LoadTestForm code={structure.code} timeZone={zone} gauges={gauges.map((g) => ({ tag: g.tag, label: g.label ?? null, member: g.member ?? null }))} action={recordLoadTestAction} />
          )}
        </section>
      )}
    </div>
  );
}

import type { Metadata } from "next";
import { UploadForm } from "@/components/upload/upload-form";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { getVisibleStructure } from "@/lib/services/structures";
import { listGauges } from "@/lib/services/gauges";
import { inputName } from "@/lib/gauges/labels";
import { EmptyState } from "@/components/ui/empty-state";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Upload readings · ${(await params).code}` };
}

export default async function UploadPage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  await pageGuard(requirePermission(user, "readings:ingest", structure));
  const gauges = (await listGauges(user, code)).filter((gauge) => gauge.status === "active");
  return (
    <>
      <PageHeader
        title="Upload a logger file"
        subtitle={
          <>
            <span className="font-mono">{structure.code}</span> · {structure.name}
          </>
        }
      />
      <section className={`${cardClass} mb-6 p-4`} aria-labelledby="upload-gauges">
        <h2 id="upload-gauges" className="mb-1 font-semibold">
          Gauges the file may name
        </h2>
        <p className="mb-3 text-sm text-slate-600 dark:text-slate-400">
          The file&apos;s <span className="font-mono">gauge</span> column names one of these tags; its <span className="font-mono">value</span> is in that gauge&apos;s logger
          output.
        </p>
        {gauges.length === 0 ? (
          <EmptyState title="No active gauges on this structure">
            <p>Register the gauges first: rows for a tag the structure does not have are rejected.</p>
          </EmptyState>
        ) : (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Gauges and their logger output">
            <table className={tableClass}>
              <thead>
                <tr>
                  <th className={thClass}>Tag</th>
                  <th className={thClass}>Where</th>
                  <th className={thClass}>Value column in</th>
                </tr>
              </thead>
              <tbody>
                {gauges.map((gauge) => (
                  <tr key={gauge.tag} data-testid="upload-gauge">
                    <td className={`${tdClass} font-mono`}>{gauge.tag}</td>
                    <td className={`${tdClass} text-xs`}>{gauge.label ?? "—"}</td>
                    <td className={tdClass}>{inputName(gauge.input)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
      <UploadForm code={structure.code} structureTimezone={structure.timezone} />
    </>
  );
}

import type { Metadata } from "next";
import Link from "next/link";
import { CertificateForm } from "@/components/field-records/certificate-form";
import { CertificateTable } from "@/components/field-records/certificate-table";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { may } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { listCertificates } from "@/lib/services/certificates";
import { listGauges } from "@/lib/services/gauges";
import { getVisibleStructure } from "@/lib/services/structures";
import { listLoggerTokens } from "@/lib/services/tokens";

type Props = { params: Promise<{ code: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: `Calibration certificates · ${(await params).code}` };
}

const daysInWords = (days: number[]) => days.map((n) => `${n} day${n === 1 ? "" : "s"}`).join(", ");

/** The structure's calibration certificates and, for technicians and engineers, the form that records one. */
export default async function CertificatesPage({ params }: Props) {
  const { code } = await params;
  const user = await requireUser();
  const structure = await pageGuard(getVisibleStructure(user, code));
  const [list, canAdd, seesTokens] = await Promise.all([listCertificates(user, code), may(user, "field-record:add", structure), may(user, "token:manage", structure)]);
  const gauges = canAdd ? (await listGauges(user, code)).filter((gauge) => gauge.status === "active") : [];
  const loggerNames = canAdd && seesTokens ? (await listLoggerTokens(user, code)).filter((token) => !token.revokedAt).map((token) => token.name) : [];
  return (
    <div className="space-y-8">
      <PageHeader
        title={`Calibration certificates: ${structure.name}`}
        subtitle={
          <>
            Dates on the structure&apos;s calendar ({structure.timezone}), today {list.today}
            <Link href={`/structures/${encodeURIComponent(structure.code)}`} className="ml-2 text-accent underline">
              Structure page
            </Link>
          </>
        }
      />
      <section aria-labelledby="certificates-heading" className="space-y-3">
        <h2 id="certificates-heading" className="text-lg font-semibold">
          Certificates
        </h2>
        <p className="text-sm text-slate-600 dark:text-slate-400">
          The structure&apos;s technicians and engineers are e-mailed once, {daysInWords(list.reminderDays)} before a certificate expires, unless a later certificate of the same instrument replaces it.
        </p>
        {list.certificates.length === 0 ? (
          <EmptyState title="No calibration certificates recorded yet">
            A certificate records when a gauge or logger was calibrated, by whom, and until when the calibration holds. {canAdd ? "Record one with the form below." : "Technicians and engineers record them."}
          </EmptyState>
        ) : (
          <CertificateTable code={structure.code} certificates={list.certificates} />
        )}
      </section>
      {canAdd && (
        <section aria-labelledby="add-certificate-heading" className="space-y-3">
          <h2 id="add-certificate-heading" className="text-lg font-semibold">
            Record a certificate
          </h2>
          <CertificateForm code={structure.code} gauges={gauges.map((gauge) => ({ tag: gauge.tag, label: gauge.label ?? null }))} loggerNames={loggerNames} />
        </section>
      )}
    </div>
  );
}

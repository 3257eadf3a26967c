import Link from "next/link";
import type { UserActor } from "@/lib/auth/actor";
import { listCertificates } from "@/lib/services/certificates";
import { EmptyState } from "@/components/ui/empty-state";
import { CertificateTable } from "./certificate-table";

/** The calibration certificates of a structure, or of one of its gauges, with a link to the page that records them. */
export async function CertificatesSection({ user, code, gauge }: { user: UserActor; code: string; gauge?: string }) {
  const { certificates } = await listCertificates(user, code, { gauge });
  const page = `/structures/${encodeURIComponent(code)}/certificates`;
  return (
    <section className="space-y-3" aria-labelledby="certificates-section-heading">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="certificates-section-heading" className="text-lg font-semibold">
          Calibration certificates
        </h2>
        <Link href={page} className="text-sm font-medium text-accent underline">
          {gauge ? "All certificates of the structure" : "Certificates page"}
        </Link>
      </div>
      {certificates.length === 0 ? (
        <EmptyState title={gauge ? `No calibration certificate recorded for ${gauge}` : "No calibration certificates recorded yet"}>
          Certificates of gauges and loggers are recorded on the certificates page, with their expiry date.
        </EmptyState>
      ) : (
        <CertificateTable code={code} certificates={certificates} showInstrument={!gauge} />
      )}
    </section>
  );
}

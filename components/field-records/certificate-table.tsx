import Link from "next/link";
import type { CertificateState, CertificateView } from "@/lib/api/field-record-schemas";
import { cardClass, stackedTable, thClass } from "@/components/ui/styles";

const STATE_WORD: Record<CertificateState, string> = { expired: "Expired", expiring: "Expiring", valid: "Valid" };
const STATE_CLASS: Record<CertificateState, string> = {
  expired: "bg-red-50 text-critical ring-red-300 dark:bg-red-950/50 dark:text-red-200",
  expiring: "bg-amber-50 text-amber-900 ring-amber-300 dark:bg-amber-950/50 dark:text-amber-100",
  valid: "bg-emerald-50 text-emerald-900 ring-emerald-300 dark:bg-emerald-950/50 dark:text-emerald-100",
};

const kilobytes = (bytes: number) => `${Math.max(1, Math.round(bytes / 1000)).toLocaleString("en-US")} kB`;

/** Certificates with where each stands in a word and a sentence with its date; a phone gets them as stacked cards. */
export function CertificateTable({ code, certificates, showInstrument = true }: { code: string; certificates: CertificateView[]; showInstrument?: boolean }) {
  return (
    <div className={cardClass}>
      <table className={stackedTable.table} data-testid="certificate-table">
        <thead className={stackedTable.head}>
          <tr>
            {showInstrument && <th className={thClass}>Instrument</th>}
            <th className={thClass}>Certificate</th>
            <th className={thClass}>Issued</th>
            <th className={thClass}>Standing</th>
            <th className={thClass}>File</th>
          </tr>
        </thead>
        <tbody className={stackedTable.body}>
          {certificates.map((certificate) => (
            <tr key={certificate.id} className={stackedTable.row} data-testid="certificate-row">
              {showInstrument && (
                <td className={stackedTable.cell} data-label="Instrument">
                  {certificate.gauge ? (
                    <Link href={`/structures/${encodeURIComponent(code)}/gauges/${encodeURIComponent(certificate.gauge)}`} className="font-mono text-accent underline">
                      {certificate.gauge}
                    </Link>
                  ) : (
                    <span>Logger: {certificate.logger}</span>
                  )}
                </td>
              )}
              <td className={stackedTable.cell} data-label="Certificate">
                <span className="font-medium">{certificate.number}</span>
                <span className="block text-xs text-slate-500 dark:text-slate-400">by {certificate.issuedBy}</span>
              </td>
              <td className={stackedTable.cell} data-label="Issued">
                {certificate.issuedOn}
              </td>
              <td className={stackedTable.cell} data-label="Standing">
                <span className={`mr-2 inline-block rounded px-1.5 py-0.5 text-xs font-semibold ring-1 ${STATE_CLASS[certificate.state]}`}>{STATE_WORD[certificate.state]}</span>
                <span data-testid="certificate-standing">{certificate.standing}</span>
                {certificate.replacedBy && <span className="block text-xs text-slate-500 dark:text-slate-400">Replaced by certificate {certificate.replacedBy}</span>}
              </td>
              <td className={stackedTable.cell} data-label="File">
                <a href={certificate.file.url} className="text-accent underline">
                  {certificate.file.contentType === "application/pdf" ? "PDF" : "Image"}, {kilobytes(certificate.file.bytes)}
                </a>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

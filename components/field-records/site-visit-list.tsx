import Link from "next/link";
import type { SiteVisitView } from "@/lib/api/field-record-schemas";
import { formatInTimeZone } from "@/lib/time-format";
import { cardClass } from "@/components/ui/styles";

/** Visits as cards, newest first: when on the structure's clock, who, what, the gauges named (linked) and the photos. */
export function SiteVisitList({ code, timeZone, visits }: { code: string; timeZone: string; visits: SiteVisitView[] }) {
  const gaugeHref = (tag: string) => `/structures/${encodeURIComponent(code)}/gauges/${encodeURIComponent(tag)}`;
  return (
    <ol className="space-y-3">
      {visits.map((visit) => (
        <li key={visit.id} className={`${cardClass} space-y-2 p-4`} data-testid="site-visit">
          <p className="text-sm">
            <span className="font-semibold">{formatInTimeZone(new Date(visit.visitedAt), timeZone)}</span> · {visit.visitor}
          </p>
          <p className="text-sm">{visit.work}</p>
          <p className="text-sm text-slate-600 dark:text-slate-400">
            {visit.gauges.length === 0 ? (
              "No gauge named."
            ) : (
              <>
                Gauges:{" "}
                {visit.gauges.map((tag, i) => (
                  <span key={tag}>
                    {i > 0 && ", "}
                    <Link href={gaugeHref(tag)} className="font-mono text-accent underline">
                      {tag}
                    </Link>
                  </span>
                ))}
              </>
            )}
          </p>
          {visit.photos.length > 0 && (
            <ul className="flex flex-wrap gap-2">
              {visit.photos.map((photo) => (
                <li key={photo.id}>
                  <a href={photo.url} target="_blank" rel="noopener" aria-label={`Open ${photo.title} full size`}>
                    {/* eslint-disable-next-line @next/next/no-img-element -- the bytes come from the API behind the session, which the image optimiser could not fetch */}
                    <img src={photo.url} alt={photo.title} width={photo.width ?? undefined} height={photo.height ?? undefined} loading="lazy" className="h-20 w-28 rounded border border-slate-200 bg-slate-100 object-cover dark:border-slate-700" />
                  </a>
                </li>
              ))}
            </ul>
          )}
          <p className="text-xs text-slate-500 dark:text-slate-400">
            Recorded by {visit.createdBy}, {formatInTimeZone(new Date(visit.createdAt), timeZone)}
          </p>
        </li>
      ))}
    </ol>
  );
}

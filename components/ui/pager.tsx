import Link from "next/link";
import { buttonClass } from "./styles";

/**
 * Where a list stands: "51–100 of 7 178", with links to the pages either side. The page lives in
 * the address (`page=`), beside the list's filters, so a page can be bookmarked and shared.
 */
export function Pager({
  total,
  page,
  perPage,
  query,
  noun,
}: {
  total: number;
  page: number;
  perPage: number;
  /** The list's other search parameters, kept on every page link. */
  query: Record<string, string>;
  noun: string;
}) {
  const pages = Math.max(1, Math.ceil(total / perPage));
  const first = Math.min(total, (page - 1) * perPage + 1);
  const last = Math.min(total, page * perPage);
  const href = (to: number) => `?${new URLSearchParams({ ...query, page: String(to) })}`;
  const count = (n: number) => n.toLocaleString("en-US");
  // An empty list says so itself.
  if (total === 0) return null;
  return (
    <nav aria-label={`Pages of ${noun}`} className="mt-3 flex flex-wrap items-center gap-3 text-sm" data-testid="pager">
      <p data-testid="pager-count">
        {`${noun[0]!.toUpperCase()}${noun.slice(1)} ${count(first)}–${count(last)} of ${count(total)}`}
        {pages > 1 && ` · page ${count(page)} of ${count(pages)}`}
      </p>
      {page > 1 && (
        <Link href={href(page - 1)} className={buttonClass("secondary")} rel="prev">
          Previous page
        </Link>
      )}
      {page < pages && (
        <Link href={href(page + 1)} className={buttonClass("secondary")} rel="next">
          Next page
        </Link>
      )}
    </nav>
  );
}

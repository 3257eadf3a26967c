"use client";

import { useEffect } from "react";
import Link from "next/link";
import { buttonClass } from "./styles";

/**
 * What an error boundary shows: what could not be shown, that nothing stored was changed, a way
 * to try again. The error itself goes to the browser console with its digest (the server log
 * holds the same digest); its message and stack never reach the screen.
 */
export function SegmentError({ error, retry, what }: { error: unknown; retry: () => void; what: string }) {
  useEffect(() => console.error(error), [error]);
  const digest = error instanceof Error && "digest" in error && typeof error.digest === "string" ? error.digest : null;
  return (
    <div role="alert" className="mx-auto max-w-lg py-12 text-center">
      <h1 className="text-2xl font-semibold">Could not show {what}</h1>
      <p className="mt-2 text-slate-600 dark:text-slate-400">
        The server could not read what this page needs just now. Stored readings, limits and alerts are not affected.
        Try again in a moment; if it keeps failing, tell your administrator
        {digest ? (
          <>
            {" "}
            and quote reference <span className="font-mono">{digest}</span>
          </>
        ) : null}
        .
      </p>
      <div className="mt-6 flex justify-center gap-2">
        <button type="button" className={buttonClass()} onClick={() => retry()}>
          Try again
        </button>
        <Link href="/" className={buttonClass("secondary")}>
          Back to structures
        </Link>
      </div>
    </div>
  );
}

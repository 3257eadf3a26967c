"use client";

import { SegmentError } from "@/components/ui/segment-error";
import "./globals.css";

/** Replaces the root layout when the layout itself fails, so it brings its own document. */
export default function GlobalError({ error, retry }: { error: unknown; retry: () => void }) {
  return (
    <html lang="en">
      <body className="min-h-dvh font-sans">
        <title>Hookeline is unavailable</title>
        <main className="px-4">
          <SegmentError error={error} retry={retry} what="Hookeline" />
        </main>
      </body>
    </html>
  );
}

"use client";

import { SegmentError } from "@/components/ui/segment-error";

export default function SiteVisitsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SegmentError error={error} retry={retry} what="the site visits" />;
}

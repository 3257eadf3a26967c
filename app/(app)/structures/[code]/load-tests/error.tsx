"use client";

import { SegmentError } from "@/components/ui/segment-error";

export default function LoadTestsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SegmentError error={error} retry={retry} what="the load tests" />;
}

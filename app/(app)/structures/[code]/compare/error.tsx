"use client";

import { SegmentError } from "@/components/ui/segment-error";

export default function CompareError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SegmentError error={error} retry={retry} what="the comparison" />;
}

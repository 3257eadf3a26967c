"use client";

import { SegmentError } from "@/components/ui/segment-error";

export default function CertificatesError({ error, retry }: { error: unknown; retry: () => void }) {
  return <SegmentError error={error} retry={retry} what="the certificates" />;
}

"use client";

import { useRouter } from "next/navigation";
import { UploadForm } from "@/components/files/upload-form";

export function DrawingUpload({ structureCode }: { structureCode: string }) {
  const router = useRouter();
  return (
    <UploadForm
      url={`/api/v1/structures/${encodeURIComponent(structureCode)}/drawings`}
      kind="drawing"
      formLabel="Upload a drawing"
      fileLabel="Drawing image"
      submitLabel="Upload drawing"
      title={{ label: "Title", hint: "What it shows, e.g. North elevation or Deck plan, level 2.", required: true }}
      onUploaded={() => router.refresh()}
    />
  );
}

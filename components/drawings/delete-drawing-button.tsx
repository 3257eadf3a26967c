"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { deleteUploadedFile } from "@/components/files/delete-file";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass } from "@/components/ui/styles";

export function DeleteDrawingButton({ url, title, structureCode }: { url: string; title: string; structureCode: string }) {
  const router = useRouter();
  const [refusal, setRefusal] = useState<string | null>(null);

  async function remove() {
    if (!window.confirm(`Delete the drawing "${title}"? Gauges placed on it come off it. This cannot be undone.`)) return;
    const reason = await deleteUploadedFile(url);
    if (reason) return setRefusal(reason);
    router.push(`/structures/${encodeURIComponent(structureCode)}`);
    router.refresh();
  }

  return (
    <div className="space-y-2">
      <button type="button" className={buttonClass("danger")} onClick={() => void remove()}>
        Delete drawing
      </button>
      {refusal && <FormMessage state={{ status: "error", message: refusal }} />}
    </div>
  );
}

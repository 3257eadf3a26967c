"use client";

import { useId, useRef, useState } from "react";
import type { FileKind } from "@/db/schema";
import type { FileView } from "@/lib/services/files";
import { acceptAttribute, UPLOAD_LIMIT_BYTES, megabytes, uploadRule } from "@/lib/storage/upload-rules";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, inputClass } from "@/components/ui/styles";
import { postForm } from "./post-form";

type TitleField = { label: string; hint: string; required: boolean };

/**
 * An image upload form with a progress bar. The server judges the file by its content; the size
 * is also checked here first so a phone on site does not send megabytes only to have them refused.
 */
export function UploadForm({
  url,
  kind,
  formLabel,
  fileLabel,
  submitLabel,
  title,
  onUploaded,
}: {
  url: string;
  kind: FileKind;
  formLabel: string;
  fileLabel: string;
  submitLabel: string;
  title: TitleField;
  onUploaded: (file: FileView) => void;
}) {
  const id = useId();
  const form = useRef<HTMLFormElement>(null);
  /** Fraction of the body sent while an upload is under way, else null. */
  const [sent, setSent] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<ActionState>(IDLE);
  const fail = (message: string) => setOutcome({ status: "error", message });

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const file = data.get("file");
    if (!(file instanceof File) || file.size === 0) return fail("Choose an image first.");
    const limit = UPLOAD_LIMIT_BYTES[kind];
    if (file.size > limit) return fail(`This file is ${megabytes(file.size)}; the limit is ${megabytes(limit)}. Export it smaller and try again.`);
    setOutcome(IDLE);
    setSent(0);
    const answer = await postForm<FileView>(url, data, setSent);
    setSent(null);
    if (!answer.ok) return fail(answer.message);
    form.current?.reset();
    setOutcome({ status: "ok", message: `"${answer.body.title}" uploaded.` });
    onUploaded(answer.body);
  }

  return (
    <form ref={form} onSubmit={submit} aria-label={formLabel} aria-busy={sent !== null} noValidate className="space-y-3">
      <div className="space-y-1">
        <label htmlFor={`${id}-file`} className="block text-sm font-medium">
          {fileLabel}
        </label>
        <input
          id={`${id}-file`}
          name="file"
          type="file"
          accept={acceptAttribute(kind)}
          required
          aria-describedby={`${id}-rule`}
          aria-invalid={outcome.status === "error" ? true : undefined}
          className={`${inputClass} file:mr-3 file:rounded file:border-0 file:bg-slate-100 file:px-2 file:py-1 file:text-sm dark:file:bg-slate-800`}
        />
        <p id={`${id}-rule`} className="text-xs text-slate-500 dark:text-slate-400">
          {uploadRule(kind)}
        </p>
      </div>
      <div className="space-y-1">
        <label htmlFor={`${id}-title`} className="block text-sm font-medium">
          {title.label}
        </label>
        <input id={`${id}-title`} name="title" required={title.required} maxLength={120} aria-describedby={`${id}-title-hint`} className={inputClass} />
        <p id={`${id}-title-hint`} className="text-xs text-slate-500 dark:text-slate-400">
          {title.hint}
        </p>
      </div>
      <button type="submit" className={buttonClass()} disabled={sent !== null}>
        {sent !== null ? "Uploading…" : submitLabel}
      </button>
      {sent !== null && (
        <div className="space-y-1">
          <progress value={sent} max={1} className="h-2 w-full accent-accent" aria-label="Upload progress" />
          <p className="text-xs text-slate-600 dark:text-slate-400" aria-live="polite">
            {Math.round(sent * 100)} % sent
          </p>
        </div>
      )}
      <FormMessage state={outcome} />
    </form>
  );
}

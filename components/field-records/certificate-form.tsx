"use client";

import { useId, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import type { CertificateView } from "@/lib/api/field-record-schemas";
import { acceptAttribute, UPLOAD_LIMIT_BYTES, megabytes, uploadRule } from "@/lib/storage/upload-rules";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { postForm } from "@/components/files/post-form";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";

type Gauge = { tag: string; label: string | null };

/**
 * Records a calibration certificate of one of the structure's gauges or of a logger, with the
 * certificate's PDF or a photo of it. The server checks the dates, the gauge and the file; its
 * answer is shown beside the field it names.
 */
export function CertificateForm({ code, gauges, loggerNames }: { code: string; gauges: Gauge[]; loggerNames: string[] }) {
  const ids = useId();
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const [instrument, setInstrument] = useState<"gauge" | "logger">(gauges.length > 0 ? "gauge" : "logger");
  const [sending, setSending] = useState(false);
  const [outcome, setOutcome] = useState<ActionState & { field?: string }>(IDLE);
  const invalid = (field: string) => (outcome.status === "error" && outcome.field === field ? true : undefined);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    data.delete(instrument === "gauge" ? "logger" : "gauge");
    const file = data.get("file");
    if (!(file instanceof File) || file.size === 0) return setOutcome({ status: "error", message: "Choose the certificate's file first.", field: "file" });
    if (file.size > UPLOAD_LIMIT_BYTES.certificate) {
      return setOutcome({ status: "error", message: `This file is ${megabytes(file.size)}; the limit is ${megabytes(UPLOAD_LIMIT_BYTES.certificate)}.`, field: "file" });
    }
    setSending(true);
    const answer = await postForm<CertificateView>(`/api/v1/structures/${encodeURIComponent(code)}/certificates`, data, () => {});
    setSending(false);
    if (!answer.ok) return setOutcome({ status: "error", message: answer.message, field: answer.field });
    form.current?.reset();
    setOutcome({ status: "ok", message: `Certificate ${answer.body.number} recorded: ${answer.body.standing}.` });
    router.refresh();
  }

  const field = (name: string, label: string, input: React.ReactNode, hint?: string) => (
    <div className="space-y-1">
      <label htmlFor={`${ids}-${name}`} className="block text-sm font-medium">
        {label}
      </label>
      {input}
      {hint && <p className="text-xs text-slate-500 dark:text-slate-400">{hint}</p>}
    </div>
  );
  const props = (name: string) => ({ id: `${ids}-${name}`, name, "aria-invalid": invalid(name), className: inputClass });

  return (
    <form ref={form} onSubmit={submit} noValidate aria-label="Record a calibration certificate" aria-busy={sending} className={`${cardClass} space-y-4 p-4`}>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Certificate of</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {(["gauge", "logger"] as const).map((kind) => (
            <label key={kind} className="flex items-center gap-2">
              <input type="radio" name="instrument-kind" checked={instrument === kind} onChange={() => setInstrument(kind)} disabled={kind === "gauge" && gauges.length === 0} />
              {kind === "gauge" ? "A gauge" : "A logger"}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        {instrument === "gauge"
          ? field(
              "gauge",
              "Gauge",
              <select {...props("gauge")} defaultValue="">
                <option value="" disabled>
                  Choose a gauge
                </option>
                {gauges.map((gauge) => (
                  <option key={gauge.tag} value={gauge.tag}>
                    {gauge.tag}
                    {gauge.label ? ` — ${gauge.label}` : ""}
                  </option>
                ))}
              </select>,
            )
          : field(
              "logger",
              "Logger",
              <>
                <input {...props("logger")} list={`${ids}-loggers`} maxLength={100} placeholder="e.g. logger at pier 2, or its serial number" />
                <datalist id={`${ids}-loggers`}>
                  {loggerNames.map((name) => (
                    <option key={name} value={name} />
                  ))}
                </datalist>
              </>,
              "Loggers are known here by name: use the name of its token or its serial number.",
            )}
        {field("number", "Certificate number", <input {...props("number")} maxLength={80} />)}
        {field("issuedBy", "Issued by", <input {...props("issuedBy")} maxLength={200} placeholder="The calibration laboratory" />)}
        {field("issuedOn", "Issued on", <input {...props("issuedOn")} type="date" />)}
        {field("expiresOn", "Expires on", <input {...props("expiresOn")} type="date" />, "The last day the certificate is valid, on the structure's calendar.")}
      </div>
      {field(
        "file",
        "Certificate file",
        <input {...props("file")} type="file" accept={acceptAttribute("certificate")} className={`${inputClass} file:mr-3 file:rounded file:border-0 file:bg-slate-100 file:px-2 file:py-1 file:text-sm dark:file:bg-slate-800`} />,
        uploadRule("certificate"),
      )}
      <button type="submit" className={buttonClass()} disabled={sending}>
        {sending ? "Recording…" : "Record certificate"}
      </button>
      <FormMessage state={outcome} />
    </form>
  );
}

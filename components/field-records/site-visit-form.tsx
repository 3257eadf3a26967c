"use client";

import { useId, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import type { SiteVisitView } from "@/lib/api/field-record-schemas";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { MAX_VISIT_PHOTOS } from "@/lib/field-records/site-visits";
import { acceptAttribute, UPLOAD_LIMIT_BYTES, megabytes, uploadRule } from "@/lib/storage/upload-rules";
import { dayOf, wallClockInputToIso } from "@/lib/time-format";
import { postForm } from "@/components/files/post-form";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";

type Gauge = { tag: string; label: string | null };

/**
 * Records a site visit: when (on the structure's clock), who (the signed-in person unless
 * changed), what was done, the gauges touched and the photos taken. Sent as a multipart form to
 * the API, which checks every gauge and photo and stores all of it or nothing.
 */
export function SiteVisitForm({ code, timeZone, gauges, visitor, now }: { code: string; timeZone: string; gauges: Gauge[]; visitor: string; now: string }) {
  const ids = useId();
  const router = useRouter();
  const form = useRef<HTMLFormElement>(null);
  const [sent, setSent] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<ActionState & { field?: string }>(IDLE);
  const fail = (message: string, field?: string) => setOutcome({ status: "error", message, field });
  const invalid = (name: string) => (outcome.status === "error" && outcome.field?.split(".")[0] === name ? true : undefined);

  async function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const visitedAt = wallClockInputToIso(String(data.get("visitedAtClock") ?? ""), timeZone);
    if (!visitedAt) return fail("Give the date and time of the visit.", "visitedAt");
    data.delete("visitedAtClock");
    data.set("visitedAt", visitedAt);
    const photos = data.getAll("photos").filter((part): part is File => part instanceof File && part.size > 0);
    if (photos.length > MAX_VISIT_PHOTOS) return fail(`Choose at most ${MAX_VISIT_PHOTOS} photos; ${photos.length} are chosen.`, "photos");
    const tooBig = photos.find((photo) => photo.size > UPLOAD_LIMIT_BYTES["visit-photo"]);
    if (tooBig) return fail(`${tooBig.name} is ${megabytes(tooBig.size)}; each photo may be at most ${megabytes(UPLOAD_LIMIT_BYTES["visit-photo"])}.`, "photos");
    setSent(0);
    const answer = await postForm<SiteVisitView>(`/api/v1/structures/${encodeURIComponent(code)}/site-visits`, data, setSent);
    setSent(null);
    if (!answer.ok) return fail(answer.message, answer.field);
    form.current?.reset();
    setOutcome({ status: "ok", message: `Visit of ${dayOf(Date.parse(answer.body.visitedAt), timeZone)} recorded${answer.body.photos.length ? ` with ${answer.body.photos.length} photo${answer.body.photos.length > 1 ? "s" : ""}` : ""}.` });
    router.refresh();
  }

  return (
    <form ref={form} onSubmit={submit} noValidate aria-label="Record a site visit" aria-busy={sent !== null} className={`${cardClass} space-y-4 p-4`}>
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="space-y-1">
          <label htmlFor={`${ids}-when`} className="block text-sm font-medium">
            When ({timeZone})
          </label>
          <input id={`${ids}-when`} name="visitedAtClock" type="datetime-local" defaultValue={now} aria-invalid={invalid("visitedAt")} className={inputClass} />
        </div>
        <div className="space-y-1">
          <label htmlFor={`${ids}-visitor`} className="block text-sm font-medium">
            Who
          </label>
          <input id={`${ids}-visitor`} name="visitor" defaultValue={visitor} maxLength={200} aria-invalid={invalid("visitor")} className={inputClass} />
        </div>
      </div>
      <div className="space-y-1">
        <label htmlFor={`${ids}-work`} className="block text-sm font-medium">
          What was done
        </label>
        <textarea id={`${ids}-work`} name="work" rows={3} maxLength={4000} aria-invalid={invalid("work")} className={inputClass} placeholder="Checked, cleaned, replaced, re-zeroed …" />
      </div>
      <fieldset className="space-y-2" aria-invalid={invalid("gauges")}>
        <legend className="text-sm font-medium">Gauges touched</legend>
        {gauges.length === 0 ? (
          <p className="text-sm text-slate-600 dark:text-slate-400">The structure has no active gauges to name.</p>
        ) : (
          <div className="grid max-h-48 gap-1 overflow-y-auto rounded-md border border-slate-200 p-2 sm:grid-cols-3 dark:border-slate-700">
            {gauges.map((gauge) => (
              <label key={gauge.tag} className="flex items-center gap-2 text-sm">
                <input type="checkbox" name="gauges" value={gauge.tag} />
                <span className="font-mono">{gauge.tag}</span>
                {gauge.label && <span className="truncate text-xs text-slate-500">{gauge.label}</span>}
              </label>
            ))}
          </div>
        )}
      </fieldset>
      <div className="space-y-1">
        <label htmlFor={`${ids}-photos`} className="block text-sm font-medium">
          Photos (optional)
        </label>
        <input
          id={`${ids}-photos`}
          name="photos"
          type="file"
          multiple
          accept={acceptAttribute("visit-photo")}
          aria-invalid={invalid("photos") ?? invalid("file")}
          className={`${inputClass} file:mr-3 file:rounded file:border-0 file:bg-slate-100 file:px-2 file:py-1 file:text-sm dark:file:bg-slate-800`}
        />
        <p className="text-xs text-slate-500 dark:text-slate-400">
          Up to {MAX_VISIT_PHOTOS}; each a {uploadRule("visit-photo")}
        </p>
      </div>
      <button type="submit" className={buttonClass()} disabled={sent !== null}>
        {sent !== null ? "Recording…" : "Record visit"}
      </button>
      {sent !== null && <progress value={sent} max={1} className="h-2 w-full accent-accent" aria-label="Upload progress" />}
      <FormMessage state={outcome} />
    </form>
  );
}

"use client";

import { useState } from "react";
import useSWR from "swr";
import type { FileView } from "@/lib/services/files";
import { fetchJson } from "@/lib/api/fetcher";
import { deleteUploadedFile } from "@/components/files/delete-file";
import { UploadForm } from "@/components/files/upload-form";
import { EmptyState } from "@/components/ui/empty-state";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass } from "@/components/ui/styles";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import { formatInTimeZone } from "@/lib/time-format";

/**
 * A gauge's installation photos with, for those allowed, an upload form and a delete button.
 * Hand it `initialPhotos` from `listGaugePhotos` (lib/services/files) to render without a round
 * trip; without them it fetches the list from the API itself.
 */
export function GaugePhotos({ structureCode, tag, timeZone, canUpload, initialPhotos }: { structureCode: string; tag: string; timeZone: string; canUpload: boolean; initialPhotos?: FileView[] }) {
  const listUrl = `/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}/photos`;
  const { data, error, mutate } = useSWR<{ photos: FileView[] }>(listUrl, fetchJson, {
    fallbackData: initialPhotos && { photos: initialPhotos },
    revalidateOnMount: !initialPhotos,
    revalidateOnFocus: false,
  });
  const [deletion, setDeletion] = useState<ActionState>(IDLE);
  const reload = () => mutate();

  async function remove(photo: FileView) {
    if (!window.confirm(`Delete the photo "${photo.title}"? This cannot be undone.`)) return;
    const refusal = await deleteUploadedFile(photo.url);
    if (refusal) return setDeletion({ status: "error", message: refusal });
    setDeletion({ status: "ok", message: `Photo "${photo.title}" deleted.` });
    await reload();
  }

  return (
    <section className={`${cardClass} p-4`} aria-labelledby={`photos-${tag}-heading`}>
      <h2 id={`photos-${tag}-heading`} className="mb-3 font-semibold">
        Installation photos
      </h2>
      {!data && !error && <p className="text-sm text-slate-500">Loading photos…</p>}
      {error && <FormMessage state={{ status: "error", message: `The photos could not be loaded: ${error.message}` }} />}
      {data &&
        (data.photos.length === 0 ? (
          <EmptyState title={`No photos of ${tag} yet`}>
            <p>A photo of the bonded gauge and its wiring helps whoever checks it next.</p>
          </EmptyState>
        ) : (
          <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {data.photos.map((photo) => (
              <li key={photo.id} data-testid="gauge-photo">
                <figure className="overflow-hidden rounded-md border border-slate-200 dark:border-slate-700">
                  <a href={photo.url} target="_blank" rel="noopener" aria-label={`Open "${photo.title}" full size`}>
                    {/* eslint-disable-next-line @next/next/no-img-element -- a plain img: the bytes come from the API behind the session, which the image optimiser could not fetch */}
                    <img src={photo.url} alt={photo.title} width={photo.width ?? undefined} height={photo.height ?? undefined} loading="lazy" className="block aspect-[4/3] w-full bg-slate-100 object-cover" />
                  </a>
                  <figcaption className="flex items-start justify-between gap-2 px-3 py-2 text-sm">
                    <span>
                      <span className="block font-medium">{photo.title}</span>
                      <span className="block text-xs text-slate-500 dark:text-slate-400">{formatInTimeZone(new Date(photo.createdAt), timeZone)}</span>
                    </span>
                    {canUpload && (
                      <button type="button" className={buttonClass("danger")} onClick={() => void remove(photo)} aria-label={`Delete photo "${photo.title}"`}>
                        Delete
                      </button>
                    )}
                  </figcaption>
                </figure>
              </li>
            ))}
          </ul>
        ))}
      <div className="mt-3">
        <FormMessage state={deletion} />
      </div>
      {canUpload && (
        <div className="mt-4 max-w-xl border-t border-slate-200 pt-4 dark:border-slate-800">
          <UploadForm
            url={listUrl}
            kind="photo"
            formLabel={`Upload a photo of ${tag}`}
            fileLabel="Photo"
            submitLabel="Upload photo"
            title={{ label: "Caption (optional)", hint: `Left empty, it reads "Installation photo of ${tag}".`, required: false }}
            onUploaded={() => void reload()}
          />
        </div>
      )}
    </section>
  );
}

import Link from "next/link";
import type { Structure } from "@/db/schema";
import type { UserActor } from "@/lib/auth/actor";
import { may } from "@/lib/auth/authorize";
import { listDrawings } from "@/lib/services/files";
import { megabytes } from "@/lib/storage/upload-rules";
import { EmptyState } from "@/components/ui/empty-state";
import { cardClass } from "@/components/ui/styles";
import { DrawingUpload } from "./drawing-upload";
import { GaugeMarker, MarkerLegend } from "./gauge-marker";
import type { ShownState } from "@/lib/alerting/condition-display";
import { labelSlots } from "@/lib/drawings/label-slots";

type Marker = { tag: string; state: ShownState; stateText: string; placement: { id: number; x: number; y: number } | null };

/** Each placed marker with the line its tag goes on, so close gauges' tags do not overlap. */
function slotted(markers: Marker[]) {
  const slots = labelSlots(markers.map((marker) => ({ tag: marker.tag, x: marker.placement!.x, y: marker.placement!.y })));
  return markers.map((marker) => ({ marker, slot: slots.get(marker.tag) ?? 0 }));
}

/** The structure page's drawings: each opens to place gauges on it; those allowed can add more. */
export async function StructureDrawings({
  user,
  structure,
  markers,
}: {
  user: UserActor;
  structure: Structure;
  /** Gauges placed on drawings, with their state now. */
  markers: Marker[];
}) {
  const [drawings, canUpload] = await Promise.all([listDrawings(user, structure.code), may(user, "gauge:register", structure)]);
  return (
    <section className={`${cardClass} mt-6 p-4`} aria-labelledby="drawings-heading">
      <h2 id="drawings-heading" className="mb-3 font-semibold">
        Drawings
      </h2>
      {drawings.length === 0 ? (
        <EmptyState title="No drawings of this structure yet">
          <p>Upload an elevation or plan, then place the gauges on it where they are installed.</p>
        </EmptyState>
      ) : (
        <ul className="grid gap-4 lg:grid-cols-2">
          {drawings.map((drawing) => (
            <li key={drawing.id}>
              <Link
                href={`/structures/${encodeURIComponent(structure.code)}/drawings/${drawing.id}`}
                className="block overflow-hidden rounded-md border border-slate-200 hover:border-accent dark:border-slate-700"
              >
                <span className="relative block bg-white">
                  {/* eslint-disable-next-line @next/next/no-img-element -- a plain img: the bytes come from the API behind the session, which the image optimiser could not fetch */}
                  <img src={drawing.url} alt="" width={drawing.width ?? undefined} height={drawing.height ?? undefined} loading="lazy" className="block w-full" />
                  {slotted(markers.filter((marker) => marker.placement?.id === drawing.id)).map(({ marker, slot }) => (
                      <GaugeMarker
                        key={marker.tag}
                        labelSlot={slot}
                        tag={marker.tag}
                        x={marker.placement!.x}
                        y={marker.placement!.y}
                        href={`/structures/${encodeURIComponent(structure.code)}/gauges/${encodeURIComponent(marker.tag)}`}
                        state={marker.state}
                        text={marker.stateText}
                        passive
                      />
                    ))}
                </span>
                <span className="block px-3 py-2">
                  <span className="block font-medium">{drawing.title}</span>
                  <span className="block text-xs text-slate-500 dark:text-slate-400">
                    {drawing.width && drawing.height ? `${drawing.width} × ${drawing.height} px · ` : ""}
                    {megabytes(drawing.bytes)}
                  </span>
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      {drawings.length > 0 && (
        <div className="mt-3">
          <MarkerLegend />
        </div>
      )}
      {canUpload && (
        <div className="mt-4 max-w-xl border-t border-slate-200 pt-4 dark:border-slate-800">
          <DrawingUpload structureCode={structure.code} />
        </div>
      )}
    </section>
  );
}

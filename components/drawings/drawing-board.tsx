"use client";

import { useState } from "react";
import type { FileView } from "@/lib/services/files";
import { FormMessage } from "@/components/ui/form-message";
import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { IDLE, type ActionState } from "@/lib/actions/action-state";
import type { ShownState } from "@/lib/alerting/condition-display";
import { GaugeMarker, MarkerLegend } from "./gauge-marker";
import { labelSlots } from "@/lib/drawings/label-slots";

export type BoardGauge = {
  tag: string;
  label: string | null;
  state: ShownState;
  /** The condition in words. */
  stateText: string;
  placement: { id: number; x: number; y: number } | null;
};

const percent = (fraction: number) => `${Math.round(fraction * 1000) / 10} %`;

/**
 * A drawing with its gauges' markers. Those allowed may pick a gauge and tap the drawing where it
 * is (or type the position), which saves the place through the placement API.
 */
export function DrawingBoard({
  structureCode,
  drawing,
  gauges: initialGauges,
  canPlace,
}: {
  structureCode: string;
  drawing: Pick<FileView, "id" | "title" | "url" | "width" | "height">;
  gauges: BoardGauge[];
  canPlace: boolean;
}) {
  const [gauges, setGauges] = useState(initialGauges);
  const [selected, setSelected] = useState("");
  const [saving, setSaving] = useState(false);
  const [outcome, setOutcome] = useState<ActionState>(IDLE);
  const placing = canPlace && selected !== "";
  const chosen = gauges.find((gauge) => gauge.tag === selected);
  const onThisDrawing = gauges.filter((gauge) => gauge.placement?.id === drawing.id);
  const slots = labelSlots(onThisDrawing.map((gauge) => ({ tag: gauge.tag, x: gauge.placement!.x, y: gauge.placement!.y })));

  async function save(tag: string, body: { drawingId: number; x: number; y: number } | { drawingId: null }) {
    setSaving(true);
    setOutcome(IDLE);
    try {
      const response = await fetch(`/api/v1/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(tag)}/placement`, {
        method: "PUT",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      });
      const answer = await response.json();
      if (!response.ok) return setOutcome({ status: "error", message: answer.error?.message ?? `Not saved (HTTP ${response.status}).` });
      setGauges((all) => all.map((gauge) => (gauge.tag === tag ? { ...gauge, placement: answer.drawing } : gauge)));
      setOutcome({
        status: "ok",
        message: answer.drawing ? `${tag} placed at ${percent(answer.drawing.x)} across, ${percent(answer.drawing.y)} down.` : `${tag} taken off the drawing.`,
      });
    } catch {
      setOutcome({ status: "error", message: "The place was not saved: the server could not be reached. Try again." });
    } finally {
      setSaving(false);
    }
  }

  function placeAtTap(event: React.MouseEvent<HTMLDivElement>) {
    if (!placing || saving) return;
    const box = event.currentTarget.getBoundingClientRect();
    const clamp = (value: number) => Math.min(1, Math.max(0, value));
    void save(selected, { drawingId: drawing.id, x: clamp((event.clientX - box.left) / box.width), y: clamp((event.clientY - box.top) / box.height) });
  }

  function placeTyped(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const x = Number(data.get("across")) / 100;
    const y = Number(data.get("down")) / 100;
    void save(selected, { drawingId: drawing.id, x, y });
  }

  return (
    <div className="space-y-4">
      {canPlace && (
        <section aria-labelledby="place-heading" className={`${cardClass} space-y-3 p-4`}>
          <h2 id="place-heading" className="font-semibold">
            Place a gauge
          </h2>
          <div className="space-y-1">
            <label htmlFor="place-gauge" className="block text-sm font-medium">
              Gauge to place
            </label>
            <select id="place-gauge" value={selected} onChange={(event) => setSelected(event.target.value)} className={inputClass} aria-describedby="place-hint">
              <option value="">Choose a gauge…</option>
              {gauges.map((gauge) => (
                <option key={gauge.tag} value={gauge.tag}>
                  {gauge.tag}
                  {gauge.label ? ` — ${gauge.label}` : ""}
                  {gauge.placement ? (gauge.placement.id === drawing.id ? " (on this drawing)" : " (on another drawing)") : ""}
                </option>
              ))}
            </select>
            <p id="place-hint" className="text-xs text-slate-500 dark:text-slate-400">
              {gauges.length === 0
                ? "This structure has no gauges yet: register them first."
                : chosen
                  ? `Now tap the drawing where ${chosen.tag} is${chosen.placement && chosen.placement.id !== drawing.id ? "; this moves it from its other drawing" : ""}.`
                  : "Choose a gauge, then tap the drawing where it is."}
            </p>
          </div>
          {chosen && (
            <details className="text-sm">
              <summary className="cursor-pointer font-medium text-accent">Type the position instead</summary>
              <form onSubmit={placeTyped} aria-label="Type the position" className="mt-2 flex flex-wrap items-end gap-3">
                {(["across", "down"] as const).map((axis) => (
                  <div key={axis} className="w-28 space-y-1">
                    <label htmlFor={`place-${axis}`} className="block text-sm font-medium">
                      {axis === "across" ? "From left, %" : "From top, %"}
                    </label>
                    <input
                      id={`place-${axis}`}
                      name={axis}
                      type="number"
                      min={0}
                      max={100}
                      step="any"
                      required
                      defaultValue={chosen.placement?.id === drawing.id ? Math.round(chosen.placement[axis === "across" ? "x" : "y"] * 1000) / 10 : undefined}
                      className={inputClass}
                    />
                  </div>
                ))}
                <button type="submit" className={buttonClass("secondary")} disabled={saving}>
                  Place here
                </button>
              </form>
            </details>
          )}
          {chosen?.placement?.id === drawing.id && (
            <button type="button" className={buttonClass("danger")} disabled={saving} onClick={() => void save(chosen.tag, { drawingId: null })}>
              Take {chosen.tag} off this drawing
            </button>
          )}
          <div aria-live="polite">{saving ? <p className="text-sm">Saving…</p> : <FormMessage state={outcome} />}</div>
        </section>
      )}

      <figure className={`${cardClass} overflow-hidden p-2`}>
        {/* eslint-disable-next-line jsx-a11y/click-events-have-key-events, jsx-a11y/no-static-element-interactions -- a pointer shortcut: the keyboard places a gauge through "Type the position instead" */}
        <div
          data-testid="drawing-canvas"
          onClick={placeAtTap}
          className={`relative ${placing ? "cursor-crosshair ring-2 ring-accent" : ""}`}
        >
          {/* eslint-disable-next-line @next/next/no-img-element -- a plain img: the bytes come from the API behind the session, which the image optimiser could not fetch */}
          <img src={drawing.url} alt={drawing.title} width={drawing.width ?? undefined} height={drawing.height ?? undefined} className="block h-auto w-full select-none" draggable={false} />
          {onThisDrawing.map((gauge) => (
            <GaugeMarker
              key={gauge.tag}
              labelSlot={slots.get(gauge.tag) ?? 0}
              tag={gauge.tag}
              x={gauge.placement!.x}
              y={gauge.placement!.y}
              state={gauge.state}
              text={gauge.stateText}
              href={`/structures/${encodeURIComponent(structureCode)}/gauges/${encodeURIComponent(gauge.tag)}`}
              passive={placing}
            />
          ))}
        </div>
        <figcaption className="px-1 pt-2 text-sm text-slate-600 dark:text-slate-400">
          {onThisDrawing.length === 0 ? "No gauges placed on this drawing yet." : `${onThisDrawing.length} gauge${onThisDrawing.length === 1 ? "" : "s"} on this drawing.`}
        </figcaption>
      </figure>
      <MarkerLegend />
    </div>
  );
}

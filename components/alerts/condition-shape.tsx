import { STATE_LOOK, type ShownState } from "@/lib/alerting/condition-display";

/** A state's shape, in its colour; the same drawing on badges, markers and legends. */
export function ConditionShape({ state, className = "size-4" }: { state: ShownState; className?: string }) {
  const look = STATE_LOOK[state];
  return (
    <svg viewBox="0 0 16 16" className={`${className} shrink-0 ${look.colour}`} aria-hidden data-shape={look.shapeName}>
      {look.marks.map((mark, i) =>
        mark.kind === "fill" ? (
          <path key={i} d={mark.d} className="fill-current" />
        ) : (
          <path
            key={i}
            d={mark.d}
            fill="none"
            className={mark.kind === "knockout" ? "stroke-white" : "stroke-current"}
            strokeWidth={mark.kind === "stroke" ? 2.2 : 2}
            strokeLinecap="round"
            strokeDasharray={mark.dashed ? "3 2" : undefined}
          />
        ),
      )}
    </svg>
  );
}

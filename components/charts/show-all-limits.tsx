"use client";

/** The switch between a value scale fitted to the data (far bounds marked at the edge) and one reaching every limit. */
export function ShowAllLimitsSwitch({ checked, onChange }: { checked: boolean; onChange: (checked: boolean) => void }) {
  return (
    <label className="flex items-center gap-2 text-sm">
      <input type="checkbox" checked={checked} onChange={(event) => onChange(event.target.checked)} />
      Show all limits (the scale then reaches every bound; otherwise it fits the data and far bounds are marked at the edge)
    </label>
  );
}

import { inputClass, buttonClass } from "@/components/ui/styles";

/** Filters live in the address, so a filtered list can be bookmarked and shared. */
export function AlertFilters({ state, level, kind }: { state: string; level: string; kind: string }) {
  const select = (name: string, label: string, value: string, options: string[]) => (
    <label className="flex flex-col gap-1 text-sm font-medium">
      {label}
      <select name={name} defaultValue={value} className={`${inputClass} w-40`}>
        {options.map((option) => (
          <option key={option}>{option}</option>
        ))}
      </select>
    </label>
  );
  return (
    <form className="mb-4 flex flex-wrap items-end gap-3" aria-label="Filter alerts">
      {select("state", "State", state, ["open", "acknowledged", "cleared", "all"])}
      {select("level", "Level", level, ["any", "watch", "warning", "critical"])}
      {select("kind", "Kind", kind, ["any", "limit", "sensor"])}
      <button type="submit" className={buttonClass("secondary")}>
        Show
      </button>
    </form>
  );
}

import { buttonClass, cardClass, inputClass } from "@/components/ui/styles";
import { monthKey, monthName, type Month } from "@/lib/report/period";

type Props = { months: Month[]; selectedMonth: string | null; fromDay: string; toDay: string; timeZone: string; error: string | null };

/**
 * Two plain GET forms, so the period lives in the address (bookmarkable, shareable) and the
 * picker works before any script has loaded.
 */
export function ReportPeriodPicker({ months, selectedMonth, fromDay, toDay, timeZone, error }: Props) {
  return (
    <section aria-label="Report period" className={`${cardClass} grid gap-4 p-4 sm:grid-cols-2 print:hidden`}>
      <form method="get" className="flex flex-wrap items-end gap-2">
        <div className="min-w-48 flex-1 space-y-1">
          <label htmlFor="report-month" className="block text-sm font-medium">
            Month
          </label>
          <select id="report-month" name="month" defaultValue={selectedMonth ?? ""} className={inputClass}>
            {selectedMonth === null && <option value="">Choose a month…</option>}
            {months.map((month) => (
              <option key={monthKey(month)} value={monthKey(month)}>
                {monthName(month)}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className={buttonClass("secondary")}>
          Show month
        </button>
      </form>
      <form method="get" className="flex flex-wrap items-end gap-2">
        <DayField name="from" label="First day" value={fromDay} />
        <DayField name="to" label="Last day" value={toDay} />
        <button type="submit" className={buttonClass("secondary")}>
          Show days
        </button>
      </form>
      <p className="text-xs text-slate-500 sm:col-span-2 dark:text-slate-400">
        Whole days in the structure&apos;s time zone ({timeZone}), the last day included.
        {error && (
          <span role="alert" className="ml-1 font-medium text-critical">
            {error} Showing the previous month instead.
          </span>
        )}
      </p>
    </section>
  );
}

function DayField({ name, label, value }: { name: "from" | "to"; label: string; value: string }) {
  return (
    <div className="space-y-1">
      <label htmlFor={`report-${name}`} className="block text-sm font-medium">
        {label}
      </label>
      <input id={`report-${name}`} type="date" name={name} defaultValue={value} required className={inputClass} />
    </div>
  );
}

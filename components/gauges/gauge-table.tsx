"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { ConditionBadge } from "@/components/alerts/state-badge";
import { useUnits } from "@/components/units/units-context";
import { cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { bySeverity, type GaugeCondition } from "@/lib/alerting/condition";
import { conditionText } from "@/lib/alerting/condition-display";
import type { StressRating } from "@/lib/mechanics";
import { formatStressRating, inDisplayUnits } from "@/lib/units";
import { formatInTimeZone } from "@/lib/time-format";

/** One row: the gauge, how it is read, and its latest converted reading (SI, as stored). */
export type GaugeTableRow = {
  tag: string;
  label: string | null;
  member: string | null;
  sensor: string;
  condition: GaugeCondition;
  retired: boolean;
  openAlerts: number;
  time: number | null;
  strain: number | null;
  stress: number | null;
  /** Latest stress against the material's yield or concrete's compressive strength. */
  rating: StressRating | null;
  temperature: number | null;
};

const column = createColumnHelper<GaugeTableRow>();

/** The tag stays in view while a phone scrolls the numbers sideways inside the table's frame. */
const STICKY_CELL = "sticky left-0 z-10 whitespace-nowrap bg-white dark:bg-slate-900";
/** Words wrap so the numbers keep their room: the table fits 1280 px with every column shown. */
const WRAPPED_CELL = "min-w-[8rem] max-w-[15rem] whitespace-normal text-xs";
const cellClassOf = (meta: unknown) => (meta as { cellClass?: string } | undefined)?.cellClass ?? "whitespace-nowrap tabular-nums";
const fixed = (value: number | null, digits: number) => (value === null || !Number.isFinite(value) ? "—" : value.toLocaleString("en-US", { minimumFractionDigits: digits, maximumFractionDigits: digits }));

/** The structure's gauges with their current values: sortable, filterable, units as the person chose. */
export function GaugeTable({ structureCode, timeZone, rows }: { structureCode: string; timeZone: string; rows: GaugeTableRow[] }) {
  const units = useUnits();
  const [sorting, setSorting] = useState<SortingState>([{ id: "state", desc: false }]);
  const [filter, setFilter] = useState("");

  const columns = useMemo(() => {
    const stressUnit = inDisplayUnits(units, "stress", 0).unit;
    const temperatureUnit = inDisplayUnits(units, "temperature", 0).unit;
    const local = (ms: number) => formatInTimeZone(ms, timeZone);
    return [
      column.accessor("tag", {
        header: "Gauge",
        meta: { cellClass: STICKY_CELL },
        cell: (info) => (
          <Link href={`/structures/${structureCode}/gauges/${encodeURIComponent(info.getValue())}`} className="font-mono font-medium text-accent underline">
            {info.getValue()}
          </Link>
        ),
      }),
      // The words are the filter's text, so "sensor fault" or "stale" finds those gauges.
      column.accessor((row) => conditionText(row.condition, row.retired), {
        id: "state",
        header: "Condition",
        sortingFn: (a, b) => Number(a.original.retired) - Number(b.original.retired) || bySeverity(a.original.condition.state, b.original.condition.state),
        cell: (info) => <ConditionBadge condition={info.row.original.condition} retired={info.row.original.retired} />,
      }),
      column.accessor((row) => [row.label, row.member].filter(Boolean).join(" · "), { id: "where", header: "Where", meta: { cellClass: WRAPPED_CELL } }),
      column.accessor("sensor", { header: "Sensor", meta: { cellClass: WRAPPED_CELL } }),
      column.accessor("strain", { header: "Strain (µε)", cell: (info) => fixed(info.getValue(), 0) }),
      column.accessor("stress", {
        header: `Stress (${stressUnit})`,
        cell: (info) => (info.getValue() === null ? "—" : fixed(inDisplayUnits(units, "stress", info.getValue()!).value, units === "us" ? 2 : 1)),
      }),
      // Sorted by the share; concrete in tension (no share) and gauges without a strength sort below every figure.
      column.accessor((row) => row.rating?.ratio ?? -1, {
        id: "utilisation",
        header: "Utilisation",
        meta: { cellClass: WRAPPED_CELL },
        cell: (info) => formatStressRating(info.row.original.rating),
      }),
      column.accessor("temperature", {
        header: `Temp. (${temperatureUnit})`,
        cell: (info) => (info.getValue() === null ? "—" : fixed(inDisplayUnits(units, "temperature", info.getValue()!).value, 1)),
      }),
      column.accessor("time", { header: "Last reading", cell: (info) => (info.getValue() === null ? "none" : local(info.getValue()!)) }),
      column.accessor("openAlerts", { header: "Open alerts" }),
    ];
  }, [structureCode, units, timeZone]);

  // eslint-disable-next-line react-hooks/incompatible-library -- the React Compiler is not used here, and the table's functions never leave this component
  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  return (
    <div className="space-y-2">
      <label className="flex max-w-sm flex-col gap-1 text-sm font-medium">
        Filter gauges
        <input className={inputClass} value={filter} onChange={(event) => setFilter(event.target.value)} placeholder="tag, member, state…" />
      </label>
      {/* Focusable, so a keyboard can scroll the table's own frame on a narrow screen. */}
      <div className={`${cardClass} overflow-x-auto`} tabIndex={0} role="region" aria-label="Gauges table, scrolls sideways">
        <table className={tableClass} aria-label="Gauges">
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} className={`${thClass} ${header.column.id === "tag" ? STICKY_CELL : ""}`} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                      <button type="button" className="inline-flex items-center gap-1" onClick={header.column.getToggleSortingHandler()}>
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden>{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-testid="gauge-row">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`${tdClass} ${cellClassOf(cell.column.columnDef.meta)}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {table.getRowModel().rows.length === 0 && <p className="p-4 text-sm text-slate-600">No gauge matches “{filter}”.</p>}
      </div>
    </div>
  );
}

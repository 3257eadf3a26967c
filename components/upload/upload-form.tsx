"use client";

import { useMemo, useState } from "react";
import { buttonClass, cardClass, inputClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import { csvField, previewRows } from "@/lib/ingest/csv-preview";
import { formatInTimeZone } from "@/lib/time-format";

/** Enough of the file to show its header and first rows without reading it all. */
const PREVIEW_BYTES = 8 * 1024;
const PREVIEW_ROWS = 6;
const SHOWN_REJECTIONS = 100;

type Rejection = { line: number; code: string; message: string };
type Arrival = { gauge: string; readings: number; from: string; to: string };
type Report = { rows: number; accepted: number; duplicates: number; rejected: number; gauges: Arrival[]; rejections: Rejection[]; rejectionsTruncated: boolean };
type Progress = { sentBytes: number; storedBytes: number; rows: number };

type Phase =
  | { kind: "idle" }
  | { kind: "running"; progress: Progress }
  | { kind: "done"; report: Report }
  | { kind: "failed"; message: string };

/** Parses the NDJSON lines received so far: progress lines, then `done` or `error`. */
function readLines(text: string) {
  return text
    .split("\n")
    .filter((line) => line.trim() !== "")
    .map((line) => JSON.parse(line) as { type: string } & Record<string, unknown>);
}

function reportCsv(file: string, report: Report): string {
  const lines = [
    `# ${file}: ${report.rows} rows, ${report.accepted} stored, ${report.duplicates} duplicates, ${report.rejected} rejected`,
    "line,code,message",
    ...report.rejections.map((r) => [r.line, r.code, r.message].map(csvField).join(",")),
  ];
  if (report.rejectionsTruncated) lines.push(`# only the first ${report.rejections.length} rejected rows are listed`);
  return `${lines.join("\n")}\n`;
}

export function UploadForm({ code, structureTimezone }: { code: string; structureTimezone: string }) {
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<string[][]>([]);
  const [timezone, setTimezone] = useState(structureTimezone);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const zones = useMemo(() => [...new Set([structureTimezone, "UTC", ...Intl.supportedValuesOf("timeZone")])], [structureTimezone]);

  async function choose(chosen: File | null) {
    setFile(chosen);
    setPhase({ kind: "idle" });
    setPreview(chosen ? previewRows(await chosen.slice(0, PREVIEW_BYTES).text(), PREVIEW_ROWS, chosen.size <= PREVIEW_BYTES) : []);
  }

  function upload() {
    if (!file) return;
    const request = new XMLHttpRequest();
    const progress: Progress = { sentBytes: 0, storedBytes: 0, rows: 0 };
    setPhase({ kind: "running", progress: { ...progress } });
    request.upload.onprogress = (event) => {
      progress.sentBytes = event.loaded;
      setPhase({ kind: "running", progress: { ...progress } });
    };
    // The server answers with a line per stored batch while it still reads the file.
    request.onprogress = () => {
      if (request.status !== 200) return;
      const last = readLines(request.responseText).findLast((line) => line.type === "progress");
      if (!last) return;
      progress.storedBytes = last.bytes as number;
      progress.rows = last.rows as number;
      setPhase({ kind: "running", progress: { ...progress } });
    };
    request.onload = () => {
      try {
        if (request.status !== 200) {
          setPhase({ kind: "failed", message: JSON.parse(request.responseText).error.message });
          return;
        }
        const last = readLines(request.responseText).at(-1);
        if (last?.type === "done") setPhase({ kind: "done", report: last as unknown as Report });
        else setPhase({ kind: "failed", message: (last?.error as { message?: string })?.message ?? "The upload ended early." });
      } catch {
        setPhase({ kind: "failed", message: "The server's answer could not be read; try again." });
      }
    };
    request.onerror = () => setPhase({ kind: "failed", message: "The connection was lost; uploading the file again is safe." });
    request.open("POST", `/api/v1/structures/${encodeURIComponent(code)}/uploads?timezone=${encodeURIComponent(timezone)}`);
    request.setRequestHeader("content-type", "text/csv");
    request.send(file);
  }

  function download(report: Report) {
    const url = URL.createObjectURL(new Blob([reportCsv(file?.name ?? "upload", report)], { type: "text/csv" }));
    const link = document.createElement("a");
    link.href = url;
    link.download = `${(file?.name ?? "upload").replace(/\.csv$/i, "")}-report.csv`;
    link.click();
    URL.revokeObjectURL(url);
  }

  const running = phase.kind === "running";
  const percent =
    phase.kind === "done" ? 100 : running && file ? Math.min(99, Math.floor((100 * phase.progress.storedBytes) / Math.max(1, file.size))) : 0;

  return (
    <div className="space-y-6">
      <section className={`${cardClass} space-y-4 p-4`} aria-label="Logger file">
        <p className="max-w-prose text-sm">
          A CSV file with the header <code className="font-mono">gauge,time,value,temperature</code>, separated by commas, decimals
          with a point. Values are raw, in each gauge&apos;s input unit. Sending a file twice is safe: readings already stored are
          counted as duplicates.
        </p>
        <div className="space-y-1">
          <label htmlFor="logger-file" className="block text-sm font-medium">
            Logger file (CSV)
          </label>
          <input
            id="logger-file"
            type="file"
            accept=".csv,text/csv"
            className={inputClass}
            disabled={running}
            onChange={(event) => void choose(event.target.files?.[0] ?? null)}
          />
        </div>
        <div className="space-y-1">
          <label htmlFor="timezone" className="block text-sm font-medium">
            Time zone of times without an offset
          </label>
          <select id="timezone" className={inputClass} value={timezone} disabled={running} onChange={(event) => setTimezone(event.target.value)}>
            {zones.map((zone) => (
              <option key={zone} value={zone}>
                {zone === structureTimezone ? `${zone} (the structure's)` : zone}
              </option>
            ))}
          </select>
          <p className="text-xs text-slate-500 dark:text-slate-400">Times ending in Z or an offset such as +01:00 keep their own.</p>
        </div>
        {preview.length > 0 && (
          <div className="overflow-x-auto">
            <table className={tableClass} aria-label="First rows of the file">
              <thead>
                <tr>
                  {preview[0]!.map((name, i) => (
                    <th key={i} className={thClass}>
                      {name}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {preview.slice(1).map((row, r) => (
                  <tr key={r}>
                    {row.map((cell, c) => (
                      <td key={c} className={`${tdClass} font-mono text-xs`}>
                        {cell}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        <button type="button" className={buttonClass()} disabled={!file || running} onClick={upload}>
          Upload
        </button>
      </section>

      {phase.kind !== "idle" && (
        <section className={`${cardClass} space-y-3 p-4`} aria-label="Import">
          <div
            role="progressbar"
            aria-label="Import progress"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={percent}
            className="h-3 overflow-hidden rounded-full bg-slate-200 dark:bg-slate-800"
          >
            <div className="h-full bg-accent transition-all" style={{ width: `${percent}%` }} />
          </div>
          {running && (
            <p className="text-sm" aria-live="polite">
              Sent {Math.floor((100 * phase.progress.sentBytes) / Math.max(1, file?.size ?? 1))}% · {phase.progress.rows.toLocaleString("en-US")}{" "}
              rows stored or checked
            </p>
          )}
          {phase.kind === "failed" && (
            <p role="alert" className="text-sm text-critical">
              {phase.message}
            </p>
          )}
          {phase.kind === "done" && <UploadReport report={phase.report} timeZone={structureTimezone} onDownload={() => download(phase.report)} />}
        </section>
      )}
    </div>
  );
}

function UploadReport({ report, timeZone, onDownload }: { report: Report; timeZone: string; onDownload: () => void }) {
  const local = (iso: string) => formatInTimeZone(new Date(iso), timeZone);
  return (
    <div className="space-y-3">
      <p className="text-sm" aria-live="polite">
        Import finished: {report.rows.toLocaleString("en-US")} rows, <strong>{report.accepted.toLocaleString("en-US")} stored</strong>,{" "}
        {report.duplicates.toLocaleString("en-US")} duplicates (already stored), {report.rejected.toLocaleString("en-US")} rejected.
      </p>
      {report.gauges.length === 0 ? (
        <p className="text-sm text-slate-600 dark:text-slate-400">No new reading was stored for any gauge.</p>
      ) : (
        <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Readings stored per gauge">
          <table className={tableClass} aria-label="Readings stored per gauge">
            <thead>
              <tr>
                <th className={thClass}>Gauge</th>
                <th className={thClass}>Readings stored</th>
                <th className={thClass}>From ({timeZone})</th>
                <th className={thClass}>To ({timeZone})</th>
              </tr>
            </thead>
            <tbody>
              {report.gauges.map((arrival) => (
                <tr key={arrival.gauge} data-testid="arrival-row">
                  <td className={`${tdClass} font-mono`}>{arrival.gauge}</td>
                  <td className={`${tdClass} tabular-nums`}>{arrival.readings.toLocaleString("en-US")}</td>
                  <td className={`${tdClass} whitespace-nowrap`}>{local(arrival.from)}</td>
                  <td className={`${tdClass} whitespace-nowrap`}>{local(arrival.to)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {report.rejected > 0 && (
        <>
          <div className="overflow-x-auto">
            <table className={tableClass} aria-label="Rejected rows">
              <thead>
                <tr>
                  <th className={thClass}>Line</th>
                  <th className={thClass}>Reason</th>
                  <th className={thClass}>What to fix</th>
                </tr>
              </thead>
              <tbody>
                {report.rejections.slice(0, SHOWN_REJECTIONS).map((rejection) => (
                  <tr key={rejection.line} data-testid="rejected-row">
                    <td className={`${tdClass} font-mono`}>{rejection.line}</td>
                    <td className={`${tdClass} font-mono text-xs`}>{rejection.code}</td>
                    <td className={tdClass}>{rejection.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {report.rejections.length > SHOWN_REJECTIONS && (
            <p className="text-xs">The first {SHOWN_REJECTIONS} are shown; the report lists {report.rejections.length}.</p>
          )}
        </>
      )}
      <button type="button" className={buttonClass("secondary")} onClick={onDownload}>
        Download report (CSV)
      </button>
    </div>
  );
}

"use client";

import { useState } from "react";
import type { PressureUnit, UnsureReason } from "@/analysis/decay/types";
import { toMicrons } from "@/analysis/shared/units";
import { Alert, Button, Select } from "@/components/ui";
import type { ImportPreview } from "@/lib/client/api";

export interface ColumnChoice {
  timeColumn: string;
  pressureColumn: string;
  unit: PressureUnit;
  timeUnit?: "s" | "min";
  /** The technician's answer when a reading such as "4,150" could be 4,150 or 4.15. */
  decimalMark?: "point" | "comma";
}

export const UNIT_LABELS: Record<PressureUnit, string> = {
  micron: "microns",
  mtorr: "mTorr (same as microns)",
  torr: "Torr",
  mmhg: "mmHg",
  pa: "Pa",
  kpa: "kPa",
  mbar: "mbar",
  hpa: "hPa",
  psia: "psia (absolute)",
  inhg: "inHg (absolute)",
};

interface Props {
  preview: ImportPreview;
  filename: string;
  busy?: boolean;
  onConfirm: (choice: ColumnChoice) => void;
  onCancel: () => void;
}

function firstNumber(preview: ImportPreview, column: string): number | null {
  const i = preview.columns.indexOf(column);
  if (i < 0) return null;
  for (const row of preview.rows) {
    const v = Number(String(row[i] ?? "").trim().replace(",", "."));
    if (row[i] !== undefined && String(row[i]).trim() !== "" && Number.isFinite(v)) return v;
  }
  return null;
}

/**
 * The importer was not sure: show the first rows and let the technician say which column is
 * time, which is pressure, and the unit, with the first reading converted as a sanity check.
 */
export function ColumnChooser({ preview, filename, busy, onConfirm, onCancel }: Props) {
  const d = preview.detected;
  const [timeColumn, setTime] = useState(d.timeColumn ?? preview.columns[0] ?? "");
  const [pressureColumn, setPressure] = useState(d.pressureColumn ?? preview.columns[1] ?? "");
  const [unit, setUnit] = useState<PressureUnit>(d.unit ?? "micron");
  const [timeUnit, setTimeUnit] = useState<"" | "s" | "min">("");
  const decimal = d.unsureReasons?.find((r) => r.code === "decimal_mark" && r.choices && r.choices.length === 2) ?? null;
  const [decimalMark, setDecimalMark] = useState<"" | "point" | "comma">("");
  const sample = firstNumber(preview, pressureColumn);
  const rows = preview.rows.slice(0, 6);

  return (
    <section aria-labelledby="chooser-title" data-testid="column-chooser" className="space-y-4 rounded-card border-2 border-flare-500 bg-surface-raised p-4 shadow-card">
      <div>
        <h2 id="chooser-title" className="text-title">Check the columns</h2>
        <p className="text-body text-fg-soft">
          Riseline is not sure how to read <span className="font-semibold text-fg">{filename}</span>. Look at the first rows and pick the columns and the unit.
        </p>
      </div>
      {d.assumptions.length > 0 && (
        <Alert tone="warning" title="What Riseline guessed">
          <ul className="list-disc pl-5">
            {d.assumptions.map((a, i) => <li key={i}>{a}</li>)}
          </ul>
        </Alert>
      )}
      <div className="overflow-x-auto rounded-lg border border-surface-line">
        <table className="min-w-full text-left text-body">
          <caption className="sr-only">First rows of the file</caption>
          <thead className="bg-surface-sunken">
            <tr>
              {preview.columns.map((c) => (
                <th key={c} scope="col" className="whitespace-nowrap px-3 py-2 font-semibold">
                  {c}
                  {c === timeColumn && <span className="ml-1 text-caption text-tide-700 dark:text-tide-300">(time)</span>}
                  {c === pressureColumn && <span className="ml-1 text-caption text-tide-700 dark:text-tide-300">(pressure)</span>}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="border-t border-surface-line">
                {preview.columns.map((_, j) => (
                  <td key={j} className="whitespace-nowrap px-3 py-1.5 tabular-nums">{r[j] ?? ""}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {decimal && <DecimalQuestion reason={decimal} value={decimalMark} onChange={setDecimalMark} />}
      <div className="grid gap-4 sm:grid-cols-2">
        <Select label="Time column" value={timeColumn} onChange={(e) => setTime(e.target.value)}>
          {preview.columns.map((c) => <option key={c} value={c}>{c}</option>)}
        </Select>
        <Select label="Pressure column" value={pressureColumn} onChange={(e) => setPressure(e.target.value)}>
          {preview.columns.map((c) => <option key={c} value={c}>{c}</option>)}
        </Select>
        <Select
          label="Pressure unit"
          value={unit}
          onChange={(e) => setUnit(e.target.value as PressureUnit)}
          hint={sample !== null ? `First reading ${sample} ${UNIT_LABELS[unit].split(" ")[0]} = ${Math.round(toMicrons(sample, unit)).toLocaleString("en-US")} microns` : undefined}
        >
          {(Object.keys(UNIT_LABELS) as PressureUnit[]).map((u) => <option key={u} value={u}>{UNIT_LABELS[u]}</option>)}
        </Select>
        <Select label="Elapsed time counts in" value={timeUnit} onChange={(e) => setTimeUnit(e.target.value as "" | "s" | "min")} hint="Only for a plain number of seconds or minutes.">
          <option value="">As Riseline reads it</option>
          <option value="s">seconds</option>
          <option value="min">minutes</option>
        </Select>
      </div>
      <div className="flex flex-col gap-3 sm:flex-row">
        <Button
          size="lg"
          busy={busy}
          disabled={decimal !== null && decimalMark === ""}
          onClick={() => onConfirm({ timeColumn, pressureColumn, unit, timeUnit: timeUnit || undefined, decimalMark: decimalMark || undefined })}
        >
          Analyse with these columns
        </Button>
        <Button size="lg" variant="quiet" onClick={onCancel} disabled={busy}>
          Choose another file
        </Button>
      </div>
    </section>
  );
}

/**
 * "4,150": 4,150 microns or 4.15? The two readings differ 1,000-fold and one of them can pass a wet or
 * leaking system, so nothing is analysed until the technician picks one, with both written out in full.
 */
function DecimalQuestion({ reason, value, onChange }: { reason: UnsureReason; value: "" | "point" | "comma"; onChange: (v: "point" | "comma") => void }) {
  const choices = reason.choices ?? [];
  return (
    <fieldset className="space-y-3 rounded-card border-2 border-flare-500 p-4" data-testid="decimal-question">
      <legend className="px-1 text-title">How is &lsquo;{choices[0]?.cell}&rsquo; written?</legend>
      <p className="text-body text-fg-soft">
        The two readings differ a thousandfold, and the file does not tell which it is. Check one reading against the gauge&rsquo;s display.
      </p>
      <div className="grid gap-2 sm:grid-cols-2">
        {choices.map((c) => (
          <label key={c.decimalMark} className={`flex min-h-tap cursor-pointer items-center gap-3 rounded-lg border px-3 py-2 ${value === c.decimalMark ? "border-tide-600 bg-surface-sunken" : "border-surface-line"}`}>
            <input type="radio" name="decimalMark" value={c.decimalMark} checked={value === c.decimalMark} onChange={() => onChange(c.decimalMark)} />
            <span>
              <span className="block text-title tabular-nums">{c.reads}</span>
              <span className="text-caption text-fg-soft">{markWords(c.cell, c.decimalMark)}</span>
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** What a choice means for the mark in the cell: "4,150" with "point" is a comma grouping thousands. */
function markWords(cell: string, decimalMark: "point" | "comma"): string {
  const comma = cell.includes(",");
  if (comma) return decimalMark === "point" ? "the comma groups thousands" : "the comma is the decimal mark";
  return decimalMark === "comma" ? "the point groups thousands" : "the point is the decimal mark";
}

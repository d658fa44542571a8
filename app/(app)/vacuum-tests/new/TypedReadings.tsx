"use client";

import { useRef, useState, type KeyboardEvent, type ClipboardEvent } from "react";
import { Alert, Button } from "@/components/ui";
import { checkReadings, parsePaste, suggestNextTime, type ReadingRow, type TimeMode } from "./readings";

interface Props {
  busy?: boolean;
  onSubmit: (readings: { time: string | number; microns: number }[], mode: TimeMode) => void;
}

const cell =
  "block w-full min-h-tap rounded-lg border-2 border-surface-line bg-surface-raised px-2 text-lead tabular-nums text-fg focus:border-tide-600 focus:outline-none dark:focus:border-tide-300";

/**
 * A quick table for readings written down from the gauge: clock time or minutes since
 * isolation, and microns. Enter moves on (time → microns → next row), a pasted column fills
 * down, and the same engine analyses them.
 */
export function TypedReadings({ busy, onSubmit }: Props) {
  const [mode, setMode] = useState<TimeMode>("minutes");
  const [rows, setRows] = useState<ReadingRow[]>([
    { time: "0", microns: "" },
    { time: "1", microns: "" },
    { time: "2", microns: "" },
    { time: "3", microns: "" },
    { time: "4", microns: "" },
  ]);
  const [problems, setProblems] = useState<string[]>([]);
  const tableRef = useRef<HTMLTableElement | null>(null);

  const focusCell = (row: number, col: "time" | "microns") => {
    requestAnimationFrame(() => {
      tableRef.current?.querySelector<HTMLInputElement>(`input[data-row="${row}"][data-col="${col}"]`)?.focus();
    });
  };

  const switchMode = (m: TimeMode) => {
    if (m === mode) return;
    setMode(m);
    setRows((rs) => rs.map((r, i) => ({ ...r, time: m === "minutes" ? String(i) : "" })));
    setProblems([]);
  };

  const addRow = (focus = true) => {
    setRows((rs) => [...rs, { time: suggestNextTime(rs, mode), microns: "" }]);
    if (focus) focusCell(rows.length, "microns");
  };

  const update = (i: number, patch: Partial<ReadingRow>) => setRows((rs) => rs.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>, i: number, col: "time" | "microns") => {
    if (e.key !== "Enter") return;
    e.preventDefault();
    if (col === "time") return focusCell(i, "microns");
    if (i === rows.length - 1) {
      setRows((rs) => [...rs, { time: suggestNextTime(rs, mode), microns: "" }]);
    }
    focusCell(i + 1, "microns");
  };

  const onPaste = (e: ClipboardEvent<HTMLInputElement>, i: number, col: "time" | "microns") => {
    const text = e.clipboardData.getData("text");
    if (!/\r?\n/.test(text.trim())) return;
    e.preventDefault();
    const cells = parsePaste(text, col);
    setRows((rs) => {
      const next = [...rs];
      cells.forEach((c, k) => {
        const at = i + k;
        while (next.length <= at) next.push({ time: suggestNextTime(next, mode), microns: "" });
        next[at] = { ...next[at], ...c };
      });
      return next;
    });
  };

  const submit = () => {
    const checked = checkReadings(rows, mode);
    setProblems(checked.problems);
    if (checked.problems.length === 0) onSubmit(checked.readings, mode);
  };

  return (
    <div className="space-y-4" data-testid="typed-readings">
      <fieldset>
        <legend className="mb-2 text-body font-semibold">Time is written as</legend>
        <div className="grid grid-cols-2 gap-2" role="radiogroup">
          {([
            ["minutes", "Minutes since isolation"],
            ["clock", "Clock time (13:05)"],
          ] as const).map(([m, label]) => (
            <label
              key={m}
              className={`flex min-h-tap cursor-pointer items-center justify-center gap-2 rounded-xl border-2 px-3 text-center text-body font-medium has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-flare-500 ${
                mode === m ? "border-tide-600 bg-tide-50 text-tide-800 dark:border-tide-300 dark:bg-tide-900 dark:text-tide-100" : "border-surface-line bg-surface-raised"
              }`}
            >
              <input type="radio" name="time-mode" value={m} checked={mode === m} onChange={() => switchMode(m)} className="sr-only" />
              {label}
            </label>
          ))}
        </div>
      </fieldset>
      <p className="text-caption text-fg-soft">
        {mode === "minutes" ? "The first row is the moment you valved off the pump (minute 0 = isolation). " : "Clock times may include the pull-down; Riseline finds the isolation. "}
        Type a reading and press Enter for the next row; an empty last row is left out. You can paste a column of numbers, or two columns (time and microns).
      </p>
      <table ref={tableRef} className="w-full border-separate border-spacing-y-1.5">
        <caption className="sr-only">Readings</caption>
        <thead>
          <tr className="text-left text-caption text-fg-soft">
            <th scope="col" className="w-8 font-medium">#</th>
            <th scope="col" className="font-medium">{mode === "minutes" ? "Minutes" : "Clock time"}</th>
            <th scope="col" className="font-medium">Microns</th>
            <th scope="col"><span className="sr-only">Remove</span></th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i}>
              <td className="pr-1 text-caption text-fg-faint tabular-nums">{i + 1}</td>
              <td className="pr-2">
                <input
                  className={cell}
                  data-row={i}
                  data-col="time"
                  aria-label={`Row ${i + 1} ${mode === "minutes" ? "minutes since isolation" : "clock time"}`}
                  inputMode={mode === "minutes" ? "decimal" : "text"}
                  placeholder={mode === "minutes" ? "0" : "13:05"}
                  value={r.time}
                  onChange={(e) => update(i, { time: e.target.value })}
                  onKeyDown={(e) => onKeyDown(e, i, "time")}
                  onPaste={(e) => onPaste(e, i, "time")}
                  enterKeyHint="next"
                />
              </td>
              <td className="pr-1">
                <input
                  className={cell}
                  data-row={i}
                  data-col="microns"
                  aria-label={`Row ${i + 1} microns`}
                  inputMode="decimal"
                  placeholder="microns"
                  value={r.microns}
                  onChange={(e) => update(i, { microns: e.target.value })}
                  onKeyDown={(e) => onKeyDown(e, i, "microns")}
                  onPaste={(e) => onPaste(e, i, "microns")}
                  enterKeyHint="next"
                />
              </td>
              <td className="w-12">
                <button
                  type="button"
                  aria-label={`Remove row ${i + 1}`}
                  disabled={rows.length <= 1}
                  onClick={() => setRows((rs) => rs.filter((_, j) => j !== i))}
                  className="inline-flex h-12 w-12 items-center justify-center rounded-lg text-title text-fg-soft hover:bg-surface-sunken disabled:opacity-30"
                >
                  ×
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <Button variant="secondary" block onClick={() => addRow()}>+ Add row</Button>
      {problems.length > 0 && (
        <Alert tone="error" title="Check these readings">
          <ul className="list-disc pl-5">
            {problems.map((p) => <li key={p}>{p}</li>)}
          </ul>
        </Alert>
      )}
      <Button size="lg" block busy={busy} onClick={submit}>Analyse readings</Button>
    </div>
  );
}

/**
 * Typed readings: parsing, the next row's suggested time, and checks, kept apart from the
 * table so the rules are easy to read.
 */
export type TimeMode = "clock" | "minutes";

export interface ReadingRow {
  time: string;
  microns: string;
}

const CLOCK = /^(\d{1,2}):(\d{2})(?::(\d{2}))?$/;

/** "13:05" or "13:05:30" → seconds since midnight, else null. */
export function clockSeconds(text: string): number | null {
  const m = CLOCK.exec(text.trim());
  if (!m) return null;
  const [h, min, s] = [Number(m[1]), Number(m[2]), m[3] ? Number(m[3]) : 0];
  if (h > 23 || min > 59 || s > 59) return null;
  return h * 3600 + min * 60 + s;
}

function formatClock(seconds: number, withSeconds: boolean): string {
  const t = ((seconds % 86400) + 86400) % 86400;
  const pad = (n: number) => String(n).padStart(2, "0");
  const base = `${pad(Math.floor(t / 3600))}:${pad(Math.floor((t % 3600) / 60))}`;
  return withSeconds ? `${base}:${pad(t % 60)}` : base;
}

export function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\s/g, "").replace(",", ".");
  if (t === "") return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/** The time a new row probably has: the last time plus the last step (1 minute when unknown). */
export function suggestNextTime(rows: ReadingRow[], mode: TimeMode): string {
  const last = rows[rows.length - 1]?.time ?? "";
  const prev = rows[rows.length - 2]?.time ?? "";
  if (mode === "minutes") {
    const a = parseNumber(last);
    if (a === null) return rows.length === 0 ? "0" : "";
    const b = parseNumber(prev);
    const step = b !== null && a - b > 0 ? a - b : 1;
    return String(Math.round((a + step) * 1000) / 1000);
  }
  const a = clockSeconds(last);
  if (a === null) return "";
  const b = clockSeconds(prev);
  const step = b !== null && a - b > 0 ? a - b : 60;
  return formatClock(a + step, CLOCK.exec(last.trim())?.[3] !== undefined || step % 60 !== 0);
}

/**
 * Pasted text → cells. Lines with two values give time and microns; lines with one value
 * fill the column that was pasted into.
 */
export function parsePaste(text: string, column: "time" | "microns"): Partial<ReadingRow>[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== "")
    .map((line) => {
      const parts = line.split(/\t|;|,(?=\s*\S)|\s+/).map((p) => p.trim()).filter(Boolean);
      if (parts.length >= 2) return { time: parts[0], microns: parts[parts.length - 1] };
      return column === "time" ? { time: parts[0] } : { microns: parts[0] };
    });
}

export interface CheckedReadings {
  readings: { time: string | number; microns: number }[];
  /** Problems in plain words, naming the row. */
  problems: string[];
}

/**
 * The readings to send and the problems to show. Rows after the last one with a reading are left
 * out, even with a time filled in (Enter after the last reading adds a row with the next time);
 * a row with neither time nor reading is skipped anywhere.
 */
export function checkReadings(rows: ReadingRow[], mode: TimeMode): CheckedReadings {
  const readings: { time: string | number; microns: number }[] = [];
  const problems: string[] = [];
  let last = rows.length - 1;
  while (last >= 0 && rows[last].microns.trim() === "") last--;
  rows.slice(0, last + 1).forEach((r, i) => {
    const n = i + 1;
    if (r.time.trim() === "" && r.microns.trim() === "") return;
    const p = parseNumber(r.microns);
    if (p === null || p < 0) problems.push(`Row ${n}: “${r.microns || "(empty)"}” is not a reading in microns.`);
    let time: string | number | null = null;
    if (mode === "minutes") {
      const m = parseNumber(r.time);
      if (m === null || m < 0) problems.push(`Row ${n}: “${r.time || "(empty)"}” is not a number of minutes.`);
      else time = m;
    } else if (clockSeconds(r.time) === null) problems.push(`Row ${n}: “${r.time || "(empty)"}” is not a clock time like 13:05.`);
    else time = r.time.trim();
    if (p !== null && p >= 0 && time !== null) readings.push({ time, microns: p });
  });
  if (problems.length === 0 && readings.length < 5) problems.push("Enter at least 5 readings taken after isolating the pump.");
  if (problems.length === 0 && mode === "minutes" && readings.length > 1) {
    for (let i = 1; i < readings.length; i++) {
      if (Number(readings[i].time) <= Number(readings[i - 1].time)) {
        problems.push(`Row ${i + 1}: ${readings[i].time} min is not after ${readings[i - 1].time} min; minutes count up from the isolation.`);
        break;
      }
    }
  }
  return { readings, problems };
}

/**
 * Numbers for the test page: microns first with SI beside (1 micron = 0.133322 Pa,
 * from 1 Torr = 101325/760 Pa exactly), durations in words, leak rates in three units.
 */
import { PA_PER_MICRON } from "@/analysis/shared/units";
import { durationWords, microns } from "@/components/curve/model";

export { durationWords, microns };

/** Three significant figures, plain below 10,000, else grouped. */
export function sig3(v: number): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1000) return Math.round(v).toLocaleString("en-US");
  return Number(v.toPrecision(3)).toString();
}

/** Pressure in pascals from microns (×0.133322). */
export function pascals(micronsValue: number): string {
  return `${sig3(micronsValue * PA_PER_MICRON)} Pa`;
}

/** 1.23e-5 → "1.23 × 10⁻⁵". */
export function scientific(v: number): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const [m, e] = v.toExponential(2).split("e");
  const sup: Record<string, string> = { "-": "⁻", "0": "⁰", "1": "¹", "2": "²", "3": "³", "4": "⁴", "5": "⁵", "6": "⁶", "7": "⁷", "8": "⁸", "9": "⁹" };
  const exp = String(Number(e)).split("").map((c) => sup[c] ?? c).join("");
  return exp === "⁰" ? m : `${m} × 10${exp}`;
}

/** "24 min 33 s from the start". */
export function atWords(seconds: number | null | undefined): string {
  return seconds == null ? "—" : `${durationWords(seconds)} from the start`;
}

export const STATUS_WORDS: Record<string, string> = {
  submitted: "Submitted",
  waiting_review: "Waiting for review",
  signed_off: "Signed off",
  sent_back: "Sent back",
};

export function dateTimeWords(iso: string | null | undefined): string {
  if (!iso) return "—";
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleString("en-US", { dateStyle: "medium", timeStyle: "short" });
}

/** Compact for the numbers grid: "45 s", "26 min", "22.5 min", "1 h 05 min". */
export function minutesShort(seconds: number): string {
  if (!Number.isFinite(seconds)) return "—";
  if (Math.abs(seconds) < 60) return `${Math.round(seconds)} s`;
  if (Math.abs(seconds) >= 3600) return durationWords(seconds);
  const m = Math.round((seconds / 60) * 10) / 10;
  return `${m} min`;
}

import { durationWords as words } from "@/analysis/shared/format";

/** A duration in words (the shared formatter), "never" when there is none (a target out of reach). */
export function durationWords(seconds: number | null): string {
  return seconds === null || !Number.isFinite(seconds) ? "never" : words(seconds);
}

export function micronsWords(m: number): string {
  return `${Math.round(m).toLocaleString("en-US")} microns`;
}

/** Minutes and seconds in words for a phone screen ("4 min 05 s", "52 s", "2 h 10 min"). */
export function durationWords(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return "never";
  if (seconds < 60) return `${Math.round(seconds)} s`;
  if (seconds < 3600) {
    const m = Math.floor(seconds / 60);
    const s = Math.round(seconds - m * 60);
    return `${m} min ${String(s).padStart(2, "0")} s`;
  }
  const h = Math.floor(seconds / 3600);
  return `${h} h ${Math.round((seconds - h * 3600) / 60)} min`;
}

export function micronsWords(m: number): string {
  return `${Math.round(m).toLocaleString("en-US")} microns`;
}

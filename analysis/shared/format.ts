/**
 * Number formatting for user-facing text, without the locale machinery: the first
 * Number.prototype.toLocaleString call of a process loads locale data, and every call after it is
 * slower than building the string by hand.
 */

/**
 * A whole number with en-US thousands separators ("12,345", "-1,000"), exactly as
 * n.toLocaleString("en-US") writes it. Anything that is not a safe-to-print integer (fractions,
 * NaN, ±Infinity, |n| ≥ 1e21) is handed to toLocaleString itself.
 */
export function groupedInteger(n: number): string {
  if (!Number.isInteger(n) || Math.abs(n) >= 1e21) return n.toLocaleString("en-US");
  if (Object.is(n, -0)) return "-0";
  const digits = String(Math.abs(n));
  let out = "";
  for (let i = 0; i < digits.length; i++) {
    if (i > 0 && (digits.length - i) % 3 === 0) out += ",";
    out += digits[i];
  }
  return n < 0 ? "-" + out : out;
}

/**
 * A duration in words for a phone screen, the one formatter every screen uses: "45 s",
 * "12 min", "12 min 5 s", "1 h", "1 h 05 min", "26 h 10 min"; a negative duration gets "−".
 * Method: round once to the unit shown last (whole seconds under an hour, whole minutes from an
 * hour on), then split the rounded total, so a part never reaches its carry ("59 min 60 s" and
 * "1 h 60 min" cannot occur: 3,599.6 s is "1 h", 7,170 s is "2 h"). Not finite → "—".
 */
export function durationWords(seconds: number): string {
  if (!Number.isFinite(seconds)) return "—";
  const sign = seconds < 0 ? "−" : "";
  const abs = Math.abs(seconds);
  const totalSeconds = Math.round(abs);
  if (totalSeconds < 3600) {
    if (totalSeconds < 60) return `${sign}${totalSeconds} s`;
    const m = Math.floor(totalSeconds / 60);
    const s = totalSeconds % 60;
    return `${sign}${m} min${s ? ` ${s} s` : ""}`;
  }
  const totalMinutes = Math.round(abs / 60);
  const h = Math.floor(totalMinutes / 60);
  const m = totalMinutes % 60;
  return `${sign}${h} h${m ? ` ${String(m).padStart(2, "0")} min` : ""}`;
}

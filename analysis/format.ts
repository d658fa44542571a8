/**
 * Number formatting for user-facing text, without the locale machinery: the first
 * Number.prototype.toLocaleString call of a process loads locale data (tens of milliseconds), and
 * every call after it is far slower than building the string by hand.
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

/** Times in the shop's own time zone, with the zone named, for the report, the PDF and the e-mail. */

/** Whether `timeZone` is an IANA zone this runtime knows ("America/Chicago", "UTC"). */
export function isKnownTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** "March 3, 2026 at 2:05 PM CST" in `timeZone` (UTC when the zone is unknown). */
export function whenInZone(at: Date | string, timeZone: string): string {
  const d = typeof at === "string" ? new Date(at) : at;
  if (Number.isNaN(d.getTime())) return String(at);
  const zone = isKnownTimeZone(timeZone) ? timeZone : "UTC";
  return d.toLocaleString("en-US", { year: "numeric", month: "long", day: "numeric", hour: "numeric", minute: "2-digit", timeZone: zone, timeZoneName: "short" });
}

/** The calendar day (YYYY-MM-DD) of an instant in `timeZone`. */
export function dayInZone(at: Date | string, timeZone: string): string {
  const d = typeof at === "string" ? new Date(at) : at;
  const zone = isKnownTimeZone(timeZone) ? timeZone : "UTC";
  // en-CA writes dates as YYYY-MM-DD.
  return d.toLocaleDateString("en-CA", { timeZone: zone, year: "numeric", month: "2-digit", day: "2-digit" });
}

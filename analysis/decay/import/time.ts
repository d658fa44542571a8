/**
 * Time cell parsers, written by hand (no Date.parse, no regex per row) because a 24-hour 1 Hz
 * log has 86,400 stamps. Every parser returns seconds as a float, or NaN when the cell is not
 * in its form. Dated forms return seconds since 1970-01-01 00:00; a stamp without a zone is
 * read as if it were UTC (local wall time: only differences between stamps matter).
 */

export type DateOrder = "ymd" | "dmy" | "mdy";

/** Days from 1970-01-01 to a proleptic Gregorian date (H. Hinnant, "chrono-compatible low-level date algorithms"). */
export function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146097 + doe - 719468;
}

const DAYS_IN_MONTH = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Written with positive comparisons so that NaN in any part is invalid. */
function validDate(y: number, m: number, d: number): boolean {
  if (!(y >= 0 && m >= 1 && m <= 12 && d >= 1 && d <= DAYS_IN_MONTH[m - 1])) return false;
  if (m === 2 && d === 29) return (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
  return true;
}

/* A tiny cursor scanner shared by the parsers below (single-threaded, so module state is safe). */
let str = "";
let pos = 0;
let digitsRead = 0;

function readInt(): number {
  let v = 0;
  const start = pos;
  while (pos < str.length) {
    const c = str.charCodeAt(pos);
    if (c < 48 || c > 57) break;
    v = v * 10 + (c - 48);
    pos++;
  }
  digitsRead = pos - start;
  return digitsRead === 0 ? NaN : v;
}

function skipSpaces(): void {
  while (pos < str.length && (str.charCodeAt(pos) === 32 || str.charCodeAt(pos) === 9)) pos++;
}

/** Reads H:MM[:SS[.fff]] at the cursor → seconds, or NaN. `maxHours` 24 for a clock, larger for a duration. */
function readClock(maxHours: number): number {
  const h = readInt();
  if (h !== h || digitsRead > 3 || str.charCodeAt(pos) !== 58 /* : */) return NaN;
  pos++;
  const m = readInt();
  if (m !== m || digitsRead !== 2 || m > 59) return NaN;
  let s = 0;
  if (str.charCodeAt(pos) === 58) {
    pos++;
    s = readInt();
    if (s !== s || digitsRead !== 2 || s > 60) return NaN;
    const c = str.charCodeAt(pos);
    if (c === 46 || c === 44) {
      // fraction: .5, .250, ,5
      pos++;
      let scale = 0.1;
      const start = pos;
      while (pos < str.length) {
        const d = str.charCodeAt(pos);
        if (d < 48 || d > 57) break;
        s += (d - 48) * scale;
        scale /= 10;
        pos++;
      }
      if (pos === start) return NaN;
    }
  }
  if (h > maxHours) return NaN;
  // a clock reads 24:00 only as the end of the day (ISO 8601:2019 §5.3.2); "24:15" is minutes and seconds
  if (maxHours === 24 && h === 24 && (m !== 0 || s !== 0)) return NaN;
  return h * 3600 + m * 60 + s;
}

/** Reads an optional AM/PM suffix and adjusts seconds of day; NaN if the hour does not fit. */
function readMeridiem(secondsOfDay: number): number {
  skipSpaces();
  if (pos >= str.length) return secondsOfDay;
  const c = str.charCodeAt(pos) | 32;
  if ((c !== 97 && c !== 112) || (str.charCodeAt(pos + 1) | 32) !== 109) return secondsOfDay;
  pos += 2;
  if (str.charCodeAt(pos) === 46) pos++; // "p.m."-less "pm." tolerance
  const hour = Math.floor(secondsOfDay / 3600);
  if (hour < 1 || hour > 12) return NaN;
  const isPm = c === 112;
  if (hour === 12) return isPm ? secondsOfDay : secondsOfDay - 12 * 3600;
  return isPm ? secondsOfDay + 12 * 3600 : secondsOfDay;
}

/** Reads an optional zone: Z, UTC, GMT, ±HH, ±HHMM, ±HH:MM, or UTC/GMT followed by one of those → seconds to subtract; NaN if malformed. */
function readZone(): number {
  skipSpaces();
  if (pos >= str.length) return 0;
  const word = str.slice(pos, pos + 3).toUpperCase();
  if (word === "UTC" || word === "GMT") {
    pos += 3;
    skipSpaces();
    if (pos >= str.length) return 0;
  }
  const c = str.charCodeAt(pos);
  if (c === 90 || c === 122) {
    pos++;
    return 0;
  }
  if (c === 43 || c === 45) {
    pos++;
    const sign = c === 45 ? -1 : 1;
    const start = pos;
    const hh = readInt();
    if (hh !== hh) return NaN;
    let offset: number;
    if (pos - start === 4) offset = Math.floor(hh / 100) * 3600 + (hh % 100) * 60;
    else if (pos - start <= 2) {
      offset = hh * 3600;
      if (str.charCodeAt(pos) === 58) {
        pos++;
        const mm = readInt();
        if (mm !== mm || digitsRead !== 2) return NaN;
        offset += mm * 60;
      }
    } else return NaN;
    return sign * offset;
  }
  return NaN;
}

function atEnd(): boolean {
  skipSpaces();
  return pos >= str.length;
}

/** Reads a date at the cursor in the given order → days since 1970, or NaN. Two-digit years are 20yy. */
function readDate(order: DateOrder): number {
  const a = readInt();
  const aLen = digitsRead;
  const sep = str.charCodeAt(pos);
  if (a !== a || (sep !== 45 && sep !== 47 && sep !== 46)) return NaN;
  pos++;
  const b = readInt();
  if (b !== b || digitsRead > 2 || str.charCodeAt(pos) !== sep) return NaN;
  pos++;
  const c = readInt();
  const cLen = digitsRead;
  if (c !== c) return NaN;
  let y: number, m: number, d: number;
  if (order === "ymd") {
    if (aLen !== 4 || cLen > 2) return NaN;
    y = a; m = b; d = c;
  } else {
    if (aLen > 2 || (cLen !== 4 && cLen !== 2)) return NaN;
    y = cLen === 2 ? 2000 + c : c;
    if (order === "dmy") { d = a; m = b; } else { m = a; d = b; }
  }
  if (!validDate(y, m, d)) return NaN;
  return daysFromCivil(y, m, d);
}

let cachedDateKey = -1;
let cachedDaySeconds = NaN;

/**
 * Fixed-position fast path for "YYYY-MM-DDTHH:MM:SS[.sss]" followed by nothing or "Z" (or a
 * space instead of T). The date's day count is cached by its digits, so a log of one day computes it
 * once. NaN = not this exact form (the general parser then decides).
 */
function parseIsoFast(s: string, length = s.length): number {
  let n = length;
  let fraction = 0;
  if (n === 23 || n === 24) {
    // ".sss" milliseconds
    const f0 = s.charCodeAt(20) - 48, f1 = s.charCodeAt(21) - 48, f2 = s.charCodeAt(22) - 48;
    if (s.charCodeAt(19) !== 46 || !(f0 >= 0 && f0 <= 9 && f1 >= 0 && f1 <= 9 && f2 >= 0 && f2 <= 9)) return NaN;
    if (n === 24 && s.charCodeAt(23) !== 90) return NaN;
    fraction = (f0 * 100 + f1 * 10 + f2) / 1000;
    n = 19;
  }
  if ((n !== 19 && n !== 20) || s.charCodeAt(4) !== 45 || s.charCodeAt(7) !== 45 || s.charCodeAt(13) !== 58 || s.charCodeAt(16) !== 58) return NaN;
  if (n === 20 && s.charCodeAt(19) !== 90) return NaN;
  const sep = s.charCodeAt(10);
  if (sep !== 84 && sep !== 32) return NaN;
  // Each character − 48 must be 0…9: one negative value makes the OR negative (huge after >>> 0); the > 9 tests catch the rest.
  const y0 = s.charCodeAt(0) - 48, y1 = s.charCodeAt(1) - 48, y2 = s.charCodeAt(2) - 48, y3 = s.charCodeAt(3) - 48;
  const m0 = s.charCodeAt(5) - 48, m1 = s.charCodeAt(6) - 48, d0 = s.charCodeAt(8) - 48, d1 = s.charCodeAt(9) - 48;
  const h0 = s.charCodeAt(11) - 48, h1 = s.charCodeAt(12) - 48, i0 = s.charCodeAt(14) - 48, i1 = s.charCodeAt(15) - 48;
  const s0 = s.charCodeAt(17) - 48, s1 = s.charCodeAt(18) - 48;
  if (((y0 | y1 | y2 | y3 | m0 | m1 | d0 | d1 | h0 | h1 | i0 | i1 | s0 | s1) >>> 0) > 15 ||
    y0 > 9 || y1 > 9 || y2 > 9 || y3 > 9 || m0 > 9 || m1 > 9 || d0 > 9 || d1 > 9 || h0 > 9 || h1 > 9 || i0 > 9 || i1 > 9 || s0 > 9 || s1 > 9) return NaN;
  const year = y0 * 1000 + y1 * 100 + y2 * 10 + y3;
  const month = m0 * 10 + m1;
  const day = d0 * 10 + d1;
  const key = year * 10000 + month * 100 + day;
  let daySeconds: number;
  if (key === cachedDateKey) daySeconds = cachedDaySeconds;
  else {
    if (!validDate(year, month, day)) return NaN;
    daySeconds = daysFromCivil(year, month, day) * 86400;
    cachedDateKey = key;
    cachedDaySeconds = daySeconds;
  }
  const hh = h0 * 10 + h1;
  const mm = i0 * 10 + i1;
  const ss = s0 * 10 + s1;
  if (hh > 24 || mm > 59 || ss > 60) return NaN;
  return daySeconds + hh * 3600 + mm * 60 + ss + fraction;
}

/**
 * Fixed-position fast path for "YYYY-MM-DDTHH:MM:SS±HH:MM" and "…±HHMM" (ISO 8601 with an offset from
 * UTC): the stamp less the offset, seconds since 1970 UTC. NaN = not this exact form.
 */
function parseIsoOffsetFast(s: string): number {
  const n = s.length;
  const sign = s.charCodeAt(19);
  if ((n !== 25 && n !== 24) || (sign !== 43 && sign !== 45)) return NaN;
  if (n === 25 && s.charCodeAt(22) !== 58) return NaN;
  const m0 = n === 25 ? 23 : 22;
  const h0 = s.charCodeAt(20) - 48, h1 = s.charCodeAt(21) - 48, i0 = s.charCodeAt(m0) - 48, i1 = s.charCodeAt(m0 + 1) - 48;
  if (!(h0 >= 0 && h0 <= 9 && h1 >= 0 && h1 <= 9 && i0 >= 0 && i0 <= 5 && i1 >= 0 && i1 <= 9)) return NaN;
  const base = parseIsoFast(s, 19);
  if (base !== base) return NaN;
  const offset = (h0 * 10 + h1) * 3600 + (i0 * 10 + i1) * 60;
  return sign === 45 ? base + offset : base - offset;
}

/**
 * Parse a date-and-time stamp: ISO 8601 ("2026-06-14T13:05:00Z", "2026-06-14 13:05:00.5+02:00")
 * or a day-first / month-first form ("14/06/2026 13:05:00", "6/14/2026 1:05:00 PM").
 * Returns seconds since 1970 (UTC when a zone is given, wall time otherwise), or NaN.
 */
export function parseDateTime(cell: string, order: DateOrder): number {
  if (order === "ymd") {
    const fast = parseIsoFast(cell);
    if (fast === fast) return fast;
    const zoned = parseIsoOffsetFast(cell);
    if (zoned === zoned) return zoned;
  }
  str = cell;
  pos = 0;
  skipSpaces();
  const days = readDate(order);
  if (days !== days) return NaN;
  const c = str.charCodeAt(pos);
  if (c === 84 || c === 116 || c === 32 || c === 95 || c === 44) {
    pos++;
    skipSpaces();
  } else if (pos >= str.length) {
    return days * 86400; // date only
  } else return NaN;
  let secondsOfDay = readClock(24);
  if (secondsOfDay !== secondsOfDay) return NaN;
  secondsOfDay = readMeridiem(secondsOfDay);
  const zone = readZone();
  if (zone !== zone || secondsOfDay !== secondsOfDay || !atEnd()) return NaN;
  return days * 86400 + secondsOfDay - zone;
}

/** Whether a date-and-time cell carries a zone designator (Z, ±hh:mm, UTC). */
export function hasZone(cell: string): boolean {
  const s = cell.trim();
  const tIndex = s.search(/[T ]\d/);
  if (tIndex < 0) return false;
  return /(Z|[+-]\d\d(:?\d\d)?|UTC|GMT)$/i.test(s.slice(tIndex + 1));
}

/** Parse a date-only cell ("2026-06-14", "14/06/2026") → days since 1970, or NaN. */
export function parseDateOnly(cell: string, order: DateOrder): number {
  str = cell;
  pos = 0;
  skipSpaces();
  const days = readDate(order);
  return days === days && atEnd() ? days : NaN;
}

/** Parse a clock time "13:05:00", "1:05 PM", "13:05:00.25" → seconds of the day, or NaN. */
export function parseClock(cell: string): number {
  str = cell;
  pos = 0;
  skipSpaces();
  let s = readClock(24);
  if (s !== s) return NaN;
  s = readMeridiem(s);
  return s === s && atEnd() ? s : NaN;
}

/**
 * Fast path for a stopwatch cell of digits only: m+:ss or h+:mm:ss, minutes and seconds two digits each
 * and under 60 → seconds; NaN for anything else (the general reader below then decides).
 */
function colonDurationFast(s: string): number {
  const n = s.length;
  if (n < 4 || n > 12) return NaN;
  const c2 = s.charCodeAt(n - 3);
  if (c2 !== 58) return NaN;
  const s0 = s.charCodeAt(n - 2) - 48, s1 = s.charCodeAt(n - 1) - 48;
  if (!(s0 >= 0 && s0 <= 5 && s1 >= 0 && s1 <= 9)) return NaN;
  let head = n - 3; // digits before the last colon
  let minutes = 0;
  let hours = 0;
  let hasHours = false;
  if (head >= 4 && s.charCodeAt(head - 3) === 58) {
    const m0 = s.charCodeAt(head - 2) - 48, m1 = s.charCodeAt(head - 1) - 48;
    if (!(m0 >= 0 && m0 <= 5 && m1 >= 0 && m1 <= 9)) return NaN;
    minutes = m0 * 10 + m1;
    head -= 3;
    hasHours = true;
  }
  let lead = 0;
  for (let i = 0; i < head; i++) {
    const d = s.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return NaN;
    lead = lead * 10 + d;
  }
  if (head === 0) return NaN;
  if (hasHours) hours = lead;
  else minutes = lead;
  return hours * 3600 + minutes * 60 + s0 * 10 + s1;
}

/** Parse an elapsed duration written with colons: "1:02:03" (h:mm:ss), "65:30" (mm:ss) → seconds. */
export function parseColonDuration(cell: string): number {
  const fast = colonDurationFast(cell);
  if (fast === fast) return fast;
  str = cell;
  pos = 0;
  skipSpaces();
  const a = readInt();
  if (a !== a || str.charCodeAt(pos) !== 58) return NaN;
  pos++;
  const b = readInt();
  if (b !== b || digitsRead !== 2 || b > 59) return NaN;
  if (str.charCodeAt(pos) !== 58) {
    // mm:ss
    let s = a * 60 + b;
    if (str.charCodeAt(pos) === 46) {
      const frac = Number("0" + str.slice(pos));
      if (frac !== frac) return NaN;
      s += frac;
      pos = str.length;
    }
    return atEnd() ? s : NaN;
  }
  pos = 0;
  const s = readClock(1e7);
  return s === s && atEnd() ? s : NaN;
}

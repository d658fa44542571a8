/** Cautions and shared helpers for findings. Our own wording. */
import type { Finding, Severity } from "../types";
import { groupedInteger } from "../../shared/format";

export const CAUTION_COMPRESSOR = "Never energise the compressor while the system is in deep vacuum.";
export const CAUTION_NITROGEN =
  "Use nitrogen only through a regulator, and never above the lowest rated test pressure of the system.";
export const CAUTION_CODES =
  "Follow the equipment maker's instructions and local codes; this result supports the technician's judgement and does not replace it.";

export const fmt = (x: number): string => groupedInteger(Math.round(x));

export function finding(
  code: string,
  severity: Severity,
  title: string,
  message: string,
  evidence: Finding["evidence"],
  checks: string[],
  cautions: string[] = [CAUTION_CODES],
  atSeconds: number | null = null,
): Finding {
  return { code, severity, title, message, evidence, checks, cautions, atSeconds };
}

/** 3-point running median of values[from..to] inclusive (edges copied), in one typed array. */
export function median3(values: ArrayLike<number>, from: number, to: number): Float64Array {
  const out = new Float64Array(Math.max(0, to - from + 1));
  for (let i = from; i <= to; i++) {
    if (i === from || i === to) out[i - from] = values[i];
    else {
      const a = values[i - 1];
      const b = values[i];
      const c = values[i + 1];
      out[i - from] = Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
    }
  }
  return out;
}

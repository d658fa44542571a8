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

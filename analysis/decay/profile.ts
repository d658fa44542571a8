/**
 * The default acceptance profile and the one place where analysis options are checked.
 *
 * Default profile — common practice in the trade, no published source: isolate at or below
 * 500 microns, hold at least 10 minutes, stay at or below 1,000 microns. Makers' manuals and
 * shops vary (for example 500 microns held for 15 or 20 minutes), so every number is overridable.
 *
 * Leak-rate threshold (our choice, no published source): a fitted steady climb of 20 microns per
 * minute or more is a leak. Why 20: a hold isolated at the 500-micron target that climbs at
 * 20 microns/min crosses the 1,000-micron limit within 25 minutes and keeps going, while the
 * outgassing of a tight, dry circuit levels off instead of climbing. It sits well above the slope a
 * few-percent gauge noise can fake over a 10-minute hold (well under 2 microns/min at 10-s
 * sampling) and well below the rates of real leaks seen in logs (hundreds of microns per minute).
 */
import { z } from "zod";
import { LogError } from "../shared/errors";
import type { AcceptanceProfile, AnalyzeOptions } from "./types";

export const DEFAULT_PROFILE: Readonly<AcceptanceProfile> = Object.freeze({
  name: "Common practice (no published source)",
  targetMicrons: 500,
  holdMinutes: 10,
  limitMicrons: 1000,
  leakRateMicronsPerMinute: 20,
});

/** Fewest readings in a hold for any verdict other than inconclusive (a 3-parameter fit needs more). */
export const MIN_HOLD_READINGS = 6;

/** A climb this fast is a gross leak or an open valve (microns per minute; common practice, no published source). */
export const GROSS_LEAK_MICRONS_PER_MINUTE = 1000;

const positive = z.number().finite().positive();

const profileSchema = z
  .object({
    name: z.string().min(1).max(120),
    targetMicrons: positive,
    holdMinutes: positive.max(24 * 60),
    limitMicrons: positive,
    leakRateMicronsPerMinute: positive,
  })
  .partial()
  .strict();

const importSchema = z
  .object({
    timeColumn: z.union([z.string().min(1), z.number().int().nonnegative()]),
    pressureColumn: z.union([z.string().min(1), z.number().int().nonnegative()]),
    unit: z.enum(["micron", "mtorr", "torr", "mmhg", "pa", "kpa", "mbar", "hpa", "psia", "inhg"]),
    timeUnit: z.enum(["s", "min"]),
    decimalMark: z.enum(["point", "comma"]),
    maxBytes: z.number().int().positive(),
    maxRows: z.number().int().positive(),
  })
  .partial()
  .strict();

const volumeSchema = z
  .object({
    litres: positive,
    lineSet: z.array(
      z
        .object({
          lengthFeet: positive,
          liquidOd: z.string().min(1),
          suctionOd: z.string().min(1),
          temper: z.enum(["annealed", "drawn"]).optional(),
        })
        .strict(),
    ),
    coilLitres: z.number().finite().nonnegative(),
  })
  .partial()
  .strict();

const optionsSchema = z
  .object({
    import: importSchema,
    profile: profileSchema,
    volume: volumeSchema,
    isolationAtSeconds: z.number().finite().nonnegative(),
    holdWindow: z
      .object({ startSeconds: z.number().finite().nonnegative(), endSeconds: z.number().finite().nonnegative() })
      .strict()
      .refine((w) => w.endSeconds > w.startSeconds, { message: "endSeconds must be after startSeconds" }),
    ambientC: z.number().finite().min(-60).max(70),
  })
  .partial()
  .strict();

export interface CheckedOptions {
  options: AnalyzeOptions;
  profile: AcceptanceProfile;
}

/**
 * Check and default the options of analyzeLog / analyzeReadings. Throws LogError("invalid_option")
 * naming the first offending field. The profile is the default with the caller's fields on top; its
 * target must lie below its limit.
 */
export function checkOptions(raw: unknown): CheckedOptions {
  const parsed = optionsSchema.safeParse(raw ?? {});
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const where = issue.path.join(".") || "options";
    throw new LogError("invalid_option", `option ${where}: ${issue.message}`, { column: where });
  }
  const options = parsed.data as AnalyzeOptions;
  const profile: AcceptanceProfile = { ...DEFAULT_PROFILE, ...(options.profile ?? {}) };
  if (profile.targetMicrons > profile.limitMicrons) {
    throw new LogError(
      "invalid_option",
      `option profile: target ${profile.targetMicrons} microns is above the limit ${profile.limitMicrons} microns`,
      { column: "profile.targetMicrons" },
    );
  }
  return { options, profile };
}

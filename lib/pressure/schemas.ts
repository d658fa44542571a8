import { z } from "zod";

const reading = z.object({ pressureGauge: z.number().finite(), temperature: z.number().finite() });

const common = {
  title: z.string().trim().max(160).optional(),
  jobId: z.string().uuid().optional().nullable(),
  temperatureUnit: z.enum(["F", "C"]),
  /** Local atmosphere in the absolute unit of the test (psia, kPa, bar); checked against its plausible range. */
  atmosphereAbs: z.number().finite().optional(),
  /** Or the site's elevation, from which the standard atmosphere (ISO 2533) is computed. */
  siteElevation: z.object({ value: z.number().finite(), unit: z.enum(["m", "ft"]) }).optional(),
  ratedTestPressureGauge: z.number().positive().finite().optional().nullable(),
  gaugeResolution: z.number().positive().finite().optional(),
  /** Required (true) when a reading went above the rated test pressure; kept on the record. */
  overPressureAcknowledged: z.boolean().optional(),
  startedAt: z.string().datetime({ offset: true }).optional(),
  testedAt: z.string().datetime({ offset: true }).optional(),
  notes: z.string().trim().max(4000).optional().nullable(),
};

const oneAtmosphere = (b: { atmosphereAbs?: number; siteElevation?: unknown }, ctx: z.RefinementCtx) => {
  if (b.atmosphereAbs !== undefined && b.siteElevation !== undefined)
    ctx.addIssue({ code: "custom", path: ["siteElevation"], message: "give the atmosphere or the site's elevation, not both" });
};

/** Readings typed by the technician: start and end, optional readings in between, and when (start and end time, or a duration). */
export const typedPressureTestSchema = z
  .object({
    source: z.literal("typed"),
    unit: z.enum(["psig", "kpa_gauge", "bar_gauge"]),
    start: reading,
    end: reading,
    /** Readings between start and end: minutes from the start and the gauge pressure. */
    readings: z.array(z.object({ minutes: z.number().finite().min(0), pressureGauge: z.number().finite() })).max(500).optional(),
    endedAt: z.string().datetime({ offset: true }).optional(),
    durationMinutes: z.number().positive().finite().max(60 * 24 * 60).optional(),
    ...common,
  })
  .superRefine((b, ctx) => {
    oneAtmosphere(b, ctx);
    const both = b.startedAt !== undefined && b.endedAt !== undefined;
    if (!both && b.durationMinutes === undefined)
      ctx.addIssue({ code: "custom", path: ["durationMinutes"], message: "give the start and end time, or the duration" });
    if (b.endedAt !== undefined && b.startedAt === undefined) ctx.addIssue({ code: "custom", path: ["startedAt"], message: "an end time needs a start time" });
    if (both) {
      const minutes = (Date.parse(b.endedAt!) - Date.parse(b.startedAt!)) / 60_000;
      if (!(minutes > 0)) ctx.addIssue({ code: "custom", path: ["endedAt"], message: "the end time must be after the start time" });
      else if (b.durationMinutes !== undefined && Math.abs(minutes - b.durationMinutes) > 1)
        ctx.addIssue({ code: "custom", path: ["durationMinutes"], message: `the duration (${b.durationMinutes} min) does not match the start and end times (${Math.round(minutes)} min)` });
    }
  });

/** A logger CSV; temperatures typed when the log has none. The log's clock gives the start time when it has one. */
export const filePressureTestSchema = z
  .object({
    source: z.literal("file"),
    csvText: z.string().min(1).max(8 * 1024 * 1024),
    /** The technician's answer when the pressure header does not say gauge or absolute. */
    ambiguousAs: z.enum(["gauge", "absolute"]).optional(),
    startTemperature: z.number().finite().optional(),
    endTemperature: z.number().finite().optional(),
    ...common,
  })
  .superRefine(oneAtmosphere);

export const pressureTestCreateSchema = z.discriminatedUnion("source", [typedPressureTestSchema, filePressureTestSchema]);
export type PressureTestCreate = z.infer<typeof pressureTestCreateSchema>;

export const pressureTestListQuery = z.object({ jobId: z.string().uuid().optional() });
export const pressureTestParams = z.object({ id: z.string().uuid("not a valid id") });

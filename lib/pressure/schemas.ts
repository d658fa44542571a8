import { z } from "zod";

const reading = z.object({ pressureGauge: z.number().finite(), temperature: z.number().finite() });

const common = {
  title: z.string().trim().max(160).optional(),
  jobId: z.string().uuid().optional().nullable(),
  temperatureUnit: z.enum(["F", "C"]),
  atmosphereAbs: z.number().positive().finite().optional(),
  ratedTestPressureGauge: z.number().positive().finite().optional().nullable(),
  gaugeResolution: z.number().positive().finite().optional(),
  testedAt: z.string().datetime({ offset: true }).optional(),
  notes: z.string().trim().max(4000).optional().nullable(),
};

/** Readings typed by the technician. */
export const typedPressureTestSchema = z.object({
  source: z.literal("typed"),
  unit: z.enum(["psig", "kpa_gauge", "bar_gauge"]),
  start: reading,
  end: reading,
  durationMinutes: z.number().positive().finite().optional(),
  ...common,
});

/** A logger CSV; temperatures typed when the log has none. */
export const filePressureTestSchema = z.object({
  source: z.literal("file"),
  csvText: z.string().min(1).max(8 * 1024 * 1024),
  ambiguousAs: z.enum(["gauge", "absolute"]).optional(),
  startTemperature: z.number().finite().optional(),
  endTemperature: z.number().finite().optional(),
  ...common,
});

export const pressureTestCreateSchema = z.discriminatedUnion("source", [typedPressureTestSchema, filePressureTestSchema]);
export type PressureTestCreate = z.infer<typeof pressureTestCreateSchema>;

export const pressureTestListQuery = z.object({ jobId: z.string().uuid().optional() });
export const pressureTestParams = z.object({ id: z.string().uuid("not a valid id") });

/**
 * zod schemas for the tests domain: upload metadata (multipart fields or JSON), typed readings,
 * re-analysis overrides and the list filters. Every input of /api/tests* passes through one.
 */
import { z } from "zod";
import { AppError } from "@/lib/errors";
import { verdictSchema } from "@/lib/contracts/vacuum-tests";

export const PRESSURE_UNITS = ["micron", "mtorr", "torr", "mmhg", "pa", "kpa", "mbar", "hpa", "psia", "inhg"] as const;

/** ASTM B280 (ACR tube) outside diameters, inches, as a tech writes them. */
export const TUBE_ODS = ["1/4", "5/16", "3/8", "1/2", "5/8", "3/4", "7/8", "1-1/8", "1-3/8", "1-5/8", "2-1/8"] as const;

const optionalText = (max: number) =>
  z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? undefined : typeof v === "string" ? v.trim() : v), z.string().max(max).optional());

/** A number from a form field ("12.5") or JSON (12.5); blank = absent. */
const optionalNumber = (min: number, max: number) =>
  z.preprocess(
    (v) => (v === "" || v === null || v === undefined ? undefined : typeof v === "string" ? Number(v.trim()) : v),
    z.number({ error: "must be a number" }).finite().min(min).max(max).optional(),
  );

const optionalUuid = z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().uuid("not a valid id").optional());

const formBoolean = z.preprocess(
  (v) => (v === "true" || v === "on" || v === "1" || v === true ? true : v === "false" || v === "0" || v === "" || v === undefined || v === false ? false : v),
  z.boolean(),
);

/** Column: a header name or a 0-based index ("2" from a form becomes 2). */
const columnChoice = z.preprocess(
  (v) => (v === "" || v === null ? undefined : typeof v === "string" && /^\d+$/.test(v.trim()) ? Number(v.trim()) : v),
  z.union([z.string().min(1).max(200), z.number().int().nonnegative()]).optional(),
);

export const importOverridesSchema = z.object({
  timeColumn: columnChoice,
  pressureColumn: columnChoice,
  unit: z.preprocess((v) => (v === "" ? undefined : v), z.enum(PRESSURE_UNITS).optional()),
  timeUnit: z.preprocess((v) => (v === "" ? undefined : v), z.enum(["s", "min"]).optional()),
  /** The technician's answer when "4,150" could be 4,150 or 4.15: "point" (a comma groups thousands) or "comma" (a decimal comma). */
  decimalMark: z.preprocess((v) => (v === "" ? undefined : v), z.enum(["point", "comma"]).optional()),
});

/** Everything about a test besides its readings (same fields in multipart and JSON). */
export const testMetadataSchema = z
  .object({
    title: optionalText(200),
    jobId: optionalUuid,
    siteId: optionalUuid,
    systemId: optionalUuid,
    newSiteName: optionalText(200),
    newSystemName: optionalText(200),
    /** Create a job (a visit) for this test in the same transaction: today, the uploader, the site and system above. */
    newJob: formBoolean.default(false),
    /** Why the visit was made ("Leak repair"); only with newJob. */
    newJobReason: optionalText(120),
    /** The visit's date as the technician's calendar says (YYYY-MM-DD); only with newJob. Default: the test's date (UTC). */
    newJobVisitedOn: z.preprocess((v) => (v === "" ? undefined : v), z.iso.date("not a date (YYYY-MM-DD)").optional()),
    refrigerant: optionalText(40),
    lineSetFeet: optionalNumber(0.1, 1000),
    liquidOd: z.preprocess((v) => (v === "" ? undefined : v), z.enum(TUBE_ODS).optional()),
    suctionOd: z.preprocess((v) => (v === "" ? undefined : v), z.enum(TUBE_ODS).optional()),
    volumeLitres: optionalNumber(0.01, 10000),
    ambientC: optionalNumber(-60, 70),
    notes: optionalText(4000),
    /** For the customer's copy of the report (the notes above stay internal). */
    customerNote: optionalText(2000),
    rigNote: optionalText(1000),
    isPractice: formBoolean.default(false),
    profileId: optionalUuid,
    /** When the test was made, if not now and not in the file (ISO 8601). */
    testedAt: z.preprocess((v) => (v === "" ? undefined : v), z.string().datetime({ offset: true }).optional()),
  })
  .merge(importOverridesSchema)
  .superRefine((m, ctx) => {
    if (m.siteId && m.newSiteName) ctx.addIssue({ code: "custom", path: ["newSiteName"], message: "give either siteId or newSiteName" });
    if (m.systemId && m.newSystemName) ctx.addIssue({ code: "custom", path: ["newSystemName"], message: "give either systemId or newSystemName" });
    if (m.newSystemName && !m.siteId && !m.newSiteName)
      ctx.addIssue({ code: "custom", path: ["newSystemName"], message: "a new system needs a site (siteId or newSiteName)" });
    if (m.jobId && m.newJob) ctx.addIssue({ code: "custom", path: ["newJob"], message: "give either jobId or newJob, not both" });
    if (!m.newJob && m.newJobReason) ctx.addIssue({ code: "custom", path: ["newJobReason"], message: "a reason goes with newJob" });
    if (!m.newJob && m.newJobVisitedOn) ctx.addIssue({ code: "custom", path: ["newJobVisitedOn"], message: "a visit date goes with newJob" });
    if (m.newJob && m.isPractice) ctx.addIssue({ code: "custom", path: ["newJob"], message: "a practice run is kept out of job records" });
    if (m.lineSetFeet !== undefined && (!m.liquidOd || !m.suctionOd))
      ctx.addIssue({ code: "custom", path: ["liquidOd"], message: "a line set needs liquidOd and suctionOd" });
  });
export type VacuumTestMetadata = z.infer<typeof testMetadataSchema>;

/** Clock "HH:MM" or "HH:MM:SS" (24-hour). */
const CLOCK = /^([01]?\d|2[0-3]):[0-5]\d(:[0-5]\d(\.\d+)?)?$/;

export const typedReadingsSchema = z
  .object({
    timeMode: z.enum(["clock", "minutes"]),
    readings: z
      .array(
        z.object({
          time: z.union([z.string().trim().min(1).max(20), z.number().finite().nonnegative()]),
          microns: z.number().finite().nonnegative().max(760000),
        }),
      )
      .min(5, "at least 5 readings are needed")
      .max(20000),
  })
  .superRefine((v, ctx) => {
    v.readings.forEach((r, i) => {
      const ok = v.timeMode === "clock" ? typeof r.time === "string" && CLOCK.test(r.time) : Number.isFinite(Number(r.time)) && Number(r.time) >= 0;
      if (!ok)
        ctx.addIssue({
          code: "custom",
          path: ["readings", i, "time"],
          message: v.timeMode === "clock" ? `reading ${i + 1}: time '${r.time}' is not HH:MM or HH:MM:SS` : `reading ${i + 1}: minutes '${r.time}' is not a number ≥ 0`,
        });
    });
  });
export type TypedReadings = z.infer<typeof typedReadingsSchema>;

/** PATCH /api/vacuum-tests/:id — the note for the customer's copy of the report (empty clears it). */
export const testNoteSchema = z
  .object({ customerNote: z.string().trim().max(2000, "at most 2,000 characters").transform((v) => (v === "" ? null : v)) })
  .strict();

export const reanalysisSchema = z
  .object({
    isolationAtSeconds: z.number().finite().nonnegative().optional(),
    holdWindow: z
      .object({ startSeconds: z.number().finite().nonnegative(), endSeconds: z.number().finite().nonnegative() })
      .refine((w) => w.endSeconds > w.startSeconds, { message: "endSeconds must be after startSeconds", path: ["endSeconds"] })
      .optional(),
    unit: z.enum(PRESSURE_UNITS).optional(),
    timeUnit: z.enum(["s", "min"]).optional(),
    decimalMark: z.enum(["point", "comma"]).optional(),
    timeColumn: z.union([z.string().min(1).max(200), z.number().int().nonnegative()]).optional(),
    pressureColumn: z.union([z.string().min(1).max(200), z.number().int().nonnegative()]).optional(),
    profileId: z.string().uuid("not a valid id").optional(),
    reason: z.string().trim().max(500).optional(),
  })
  .strict();
export type ReanalysisInput = z.infer<typeof reanalysisSchema>;

const isoDate = z.string().refine((s) => !Number.isNaN(Date.parse(s)), "not an ISO date");

export const listTestsQuerySchema = z.object({
  verdict: verdictSchema.optional(),
  technicianId: z.string().min(1).max(100).optional(),
  siteId: z.string().uuid("not a valid id").optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
  isPractice: z.enum(["true", "false"]).transform((v) => v === "true").optional(),
  cursor: z.string().max(200).optional(),
  limit: z.coerce.number().int().min(1).max(50).default(25),
});
export type ListVacuumTestsQuery = z.infer<typeof listTestsQuerySchema>;

/** An Idempotency-Key header value: printable, 1–200 characters. */
export const idempotencyKeySchema = z.string().trim().min(1).max(200).regex(/^[\x21-\x7e]+$/, "printable ASCII only");

/** Parse with a schema; a failure is a 400 naming the first offending field. */
export function parseInput<T>(schema: z.ZodType<T>, value: unknown, where: string): T {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const first = parsed.error.issues[0];
  const field = first?.path.join(".") || where;
  throw new AppError("invalid_input", `${field}: ${first?.message ?? "not valid"}`, {
    where,
    issues: parsed.error.issues.map((i) => ({ path: i.path.join("."), message: i.message })),
  });
}

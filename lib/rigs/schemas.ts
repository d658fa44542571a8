import { z } from "zod";
import { OIL_CHANGE_REASONS, RIG_EVENT_KINDS, RIG_ITEM_KINDS } from "@/db/schema/rigs";

const optionalText = (max: number) => z.string().trim().max(max).optional().nullable().transform((v) => (v ? v : null));
const positive = z.number().positive().finite();
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "a date as YYYY-MM-DD");

export const rigCreateSchema = z.object({
  name: z.string().trim().min(1, "name the rig").max(120),
  truck: optionalText(80),
  /** Owners and leads may give the rig to a member; technicians always keep their own. */
  keeperId: z.string().min(1).optional().nullable(),
  notes: optionalText(2000),
});

export const rigUpdateSchema = rigCreateSchema.partial();

export const rigItemSchema = z.object({
  kind: z.enum(RIG_ITEM_KINDS),
  label: z.string().trim().min(1, "name the item").max(120),
  freeAirCfm: positive.optional().nullable(),
  blankOffRatingMicrons: positive.optional().nullable(),
  oilEveryHours: positive.optional().nullable(),
  oilEveryDays: z.number().int().positive().optional().nullable(),
  checkEveryDays: z.number().int().positive().optional().nullable(),
  insideDiameterIn: positive.max(2).optional().nullable(),
  lengthFt: positive.max(100).optional().nullable(),
});

export const rigItemUpdateSchema = rigItemSchema.partial().omit({ kind: true });

export const rigEventSchema = z
  .object({
    kind: z.enum(RIG_EVENT_KINDS),
    itemId: z.string().uuid().optional().nullable(),
    occurredOn: isoDate,
    oilReason: z.enum(OIL_CHANGE_REASONS).optional().nullable(),
    lowestMicrons: positive.max(760_000).optional().nullable(),
    /** A blank-off log (gauge CSV) instead of a typed lowest reading. */
    logText: z.string().max(8 * 1024 * 1024).optional(),
    pumpHours: z.number().nonnegative().finite().optional().nullable(),
    referenceMicrons: positive.optional().nullable(),
    gaugeMicrons: positive.optional().nullable(),
    note: optionalText(2000),
  })
  .superRefine((v, ctx) => {
    if (v.kind === "oil_changed" && !v.oilReason) ctx.addIssue({ code: "custom", path: ["oilReason"], message: "say why the oil was changed" });
    if (v.kind === "blank_off" && !v.lowestMicrons && !v.logText) ctx.addIssue({ code: "custom", path: ["lowestMicrons"], message: "type the lowest reading or upload the log" });
    if (v.kind === "pump_hours" && v.pumpHours == null) ctx.addIssue({ code: "custom", path: ["pumpHours"], message: "enter the hour-meter reading" });
  });

export const testRigSchema = z.object({ rigId: z.string().uuid() });

export const rigParams = z.object({ id: z.string().uuid("not a valid id") });
export const rigItemParams = z.object({ id: z.string().uuid("not a valid id"), itemId: z.string().uuid("not a valid id") });
export const testParams = z.object({ testId: z.string().uuid("not a valid id") });
export const todayQuery = z.object({ today: isoDate.optional() });

export type RigEventInput = z.infer<typeof rigEventSchema>;

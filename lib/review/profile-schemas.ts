/** zod schema of an acceptance profile as a lead edits it (microns, minutes, microns per minute). */
import { z } from "zod";

export const profileInputSchema = z
  .object({
    name: z.string().trim().min(1, "give the profile a name").max(120),
    targetMicrons: z.number().finite().min(1).max(25_000),
    holdMinutes: z.number().finite().min(1).max(24 * 60),
    limitMicrons: z.number().finite().min(1).max(25_000),
    leakRateMicronsPerMinute: z.number().finite().positive().max(10_000),
    makeDefault: z.boolean().default(false),
  })
  .superRefine((p, ctx) => {
    if (p.limitMicrons <= p.targetMicrons)
      ctx.addIssue({ code: "custom", path: ["limitMicrons"], message: "the limit must be above the target (the hold starts at or below the target)" });
  });
export type ProfileInput = z.infer<typeof profileInputSchema>;

/** zod schemas for the practice domain: an apprentice's call, a comment, the calls list filter. */
import { z } from "zod";
import { PRACTICE_CALLS } from "@/db/schema";

export const practiceCallSchema = z.object({
  call: z.enum(PRACTICE_CALLS, { error: "choose pass, leak, moisture, leak_and_moisture or inconclusive (can't tell)" }),
  reason: z.string().trim().min(3, "say in a few words why").max(1000),
});
export type PracticeCallInput = z.infer<typeof practiceCallSchema>;

export const practiceCommentSchema = z.object({ body: z.string().trim().min(1, "write a comment").max(2000) });

export const practiceCallsQuery = z.object({ apprenticeId: z.string().min(1).max(100).optional() });

/** zod schemas for review, comments, share links, reports by e-mail and the queue filters. */
import { z } from "zod";
import { REVIEW_ACTIONS } from "./state";
import { verdictSchema } from "@/lib/contracts/vacuum-tests";

export const reviewActionSchema = z.object({
  action: z.enum(REVIEW_ACTIONS),
  note: z.string().trim().max(2000).optional().nullable(),
});

export const commentSchema = z.object({
  body: z.string().trim().min(1, "write something").max(4000),
  /** Seconds from the first data row (the curve's time base); null = about the whole test. */
  atSeconds: z.number().finite().min(0).max(30 * 86400).nullable().optional(),
});

const blankToUndefined = (v: unknown) => (v === "" ? undefined : v);

export const reviewQueueQuerySchema = z.object({
  technicianId: z.preprocess(blankToUndefined, z.string().max(100).optional()),
  verdict: z.preprocess(blankToUndefined, verdictSchema.optional()),
  help: z.preprocess(blankToUndefined, z.enum(["1", "0"]).optional()),
  limit: z.preprocess(blankToUndefined, z.coerce.number().int().min(1).max(200).default(100)),
});

/** Days a share link lives unless the lead picks otherwise (our choice: long enough for a warranty claim). */
export const DEFAULT_SHARE_DAYS = 30;

export const shareLinkCreateSchema = z.object({
  expiresInDays: z.number().int().min(1).max(365).default(DEFAULT_SHARE_DAYS),
});

export const emailReportSchema = z.object({
  to: z.string().trim().email("not an e-mail address").max(320),
  message: z.string().trim().max(2000).optional().nullable(),
});

/** The form fields beside the file of POST /api/vacuum-tests/:id/retests. */
export const retestFieldsSchema = z.object({
  /** What the technician did before the re-test ("replaced the hose gasket"). */
  note: z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().max(2000).optional()),
});

/** zod schemas of the mail settings: the shop's (owner) and each person's own. */
import { z } from "zod";
import { MAIL_KINDS } from "@/db/schema";

/** A display name only: no angle brackets, quotes or line breaks (they would break the From header). */
export const senderNameSchema = z
  .string()
  .trim()
  .max(60, "at most 60 characters")
  .refine((s) => !/[<>"\\\r\n]/.test(s), { message: "letters, digits and spaces only; no < > \" or line breaks" })
  .transform((s) => (s === "" ? null : s));

export const shopMailSettingsSchema = z
  .object({
    senderName: senderNameSchema.nullable(),
    /** Who receives review mail: "leads" (every lead, owners when there is none) or chosen members. */
    reviewMailTo: z.union([z.literal("leads"), z.array(z.string().min(1)).min(1, "choose at least one person, or every lead").max(50)]),
  })
  .strict();

export const myMailSchema = z.object({ off: z.array(z.enum(MAIL_KINDS)).max(MAIL_KINDS.length) }).strict();

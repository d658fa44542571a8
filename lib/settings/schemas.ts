/** zod schemas of the shop's own settings. */
import { z } from "zod";
import { isKnownTimeZone } from "@/lib/reports/time";

/** An IANA time zone this server knows ("America/Chicago", "Europe/Berlin", "UTC"). */
export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, "choose a time zone")
  .max(64)
  .refine(isKnownTimeZone, { message: "not a time zone this server knows (an IANA name such as America/Chicago)" });

export const shopSettingsSchema = z.object({ timeZone: timeZoneSchema }).strict();
export type ShopSettingsInput = z.infer<typeof shopSettingsSchema>;

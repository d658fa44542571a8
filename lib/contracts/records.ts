/**
 * What the pickers' list routes answer (GET /api/sites, /api/systems, /api/jobs, /api/profiles,
 * /api/members). Every list comes under a named key; dates are ISO 8601 strings.
 * Plain module: safe in the browser bundle.
 */
import { z } from "zod";

export const siteItemSchema = z.strictObject({
  id: z.string(),
  name: z.string(),
  address: z.string().nullable(),
  customerId: z.string().nullable(),
  customerName: z.string().nullable(),
  createdAt: z.string(),
});
export type SiteItem = z.infer<typeof siteItemSchema>;

export const systemItemSchema = z.strictObject({
  id: z.string(),
  siteId: z.string(),
  name: z.string(),
  kind: z.string().nullable(),
  refrigerant: z.string().nullable(),
  factoryChargeKg: z.number().nullable(),
  lineSetFeet: z.number().nullable(),
  liquidOd: z.string().nullable(),
  suctionOd: z.string().nullable(),
  indoorCoilLitres: z.number().nullable(),
  outdoorUnitLitres: z.number().nullable(),
  installedOn: z.string().nullable(),
  createdAt: z.string(),
});
export type SystemItem = z.infer<typeof systemItemSchema>;

/** A visit; it has no name of its own (the picker labels it by reference, date and reason). */
export const jobItemSchema = z.strictObject({
  id: z.string(),
  siteId: z.string().nullable(),
  systemId: z.string().nullable(),
  technicianId: z.string().nullable(),
  visitedOn: z.string(),
  reason: z.string().nullable(),
  reference: z.string().nullable(),
  createdAt: z.string(),
  /** Whose job it is, for the pickers ("WO-4147 · 2026-12-02 · New install — customer, site"). */
  siteName: z.string().nullable(),
  customerName: z.string().nullable(),
});
export type JobItem = z.infer<typeof jobItemSchema>;

/** An acceptance profile; id null is the engine's built-in default. */
export const profileItemSchema = z.strictObject({
  id: z.string().nullable(),
  name: z.string(),
  targetMicrons: z.number(),
  holdMinutes: z.number(),
  limitMicrons: z.number(),
  leakRateMicronsPerMinute: z.number(),
  isDefault: z.boolean(),
});
export type ProfileItem = z.infer<typeof profileItemSchema>;

export const memberItemSchema = z.strictObject({
  userId: z.string(),
  role: z.string(),
  name: z.string(),
  email: z.string(),
  joinedAt: z.string(),
});
export type MemberItem = z.infer<typeof memberItemSchema>;

export const sitesAnswerSchema = z.strictObject({ items: z.array(siteItemSchema) });
export const systemsAnswerSchema = z.strictObject({ items: z.array(systemItemSchema) });
export const jobsAnswerSchema = z.strictObject({ items: z.array(jobItemSchema) });
export const profilesAnswerSchema = z.strictObject({ items: z.array(profileItemSchema) });
export const membersAnswerSchema = z.strictObject({ members: z.array(memberItemSchema) });
export type SitesAnswer = z.infer<typeof sitesAnswerSchema>;
export type SystemsAnswer = z.infer<typeof systemsAnswerSchema>;
export type JobsAnswer = z.infer<typeof jobsAnswerSchema>;
export type ProfilesAnswer = z.infer<typeof profilesAnswerSchema>;
export type MembersAnswer = z.infer<typeof membersAnswerSchema>;

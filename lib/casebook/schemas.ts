/** zod schemas for the casebook: collections, entries, pins; every /api/casebook input passes one. */
import { z } from "zod";

const text = (min: number, max: number) => z.string().trim().min(min).max(max);
const optionalNotes = z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? null : v), z.string().trim().max(4000).nullable().optional());

export const collectionCreateSchema = z.object({ title: text(1, 200), description: optionalNotes });
export const collectionUpdateSchema = z.object({ title: text(1, 200).optional(), description: optionalNotes });

export const entryCreateSchema = z.object({ testId: z.string().uuid("not a valid test id"), title: text(1, 200), notes: optionalNotes });
export const entryUpdateSchema = z.object({ title: text(1, 200).optional(), notes: optionalNotes, order: z.number().int().min(0).max(10_000).optional() });

/** A pin: seconds from the test's first data row (the stored series' time axis). */
export const pinCreateSchema = z.object({ atSeconds: z.number().finite().min(0).max(14 * 86_400), text: text(1, 280) });

export const collectionParams = z.object({ id: z.string().uuid("not a valid id") });
export const entryParams = collectionParams.extend({ entryId: z.string().uuid("not a valid id") });
export const pinParams = entryParams.extend({ pinId: z.string().uuid("not a valid id") });

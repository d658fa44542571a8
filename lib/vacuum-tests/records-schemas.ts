/** zod schemas for customers, sites, systems and jobs (the records a test hangs on). */
import { z } from "zod";
import { TUBE_ODS } from "./schemas";

const text = (max: number) => z.string().trim().min(1).max(max);
const optText = (max: number) => z.string().trim().max(max).optional().nullable();
const optNumber = (min: number, max: number) => z.number().finite().min(min).max(max).optional().nullable();
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "a date as YYYY-MM-DD");

export const createSiteSchema = z
  .object({
    name: text(200),
    address: optText(500),
    customerId: z.string().uuid("not a valid id").optional(),
    newCustomerName: text(200).optional(),
  })
  .strict()
  .refine((v) => !(v.customerId && v.newCustomerName), { message: "give either customerId or newCustomerName", path: ["newCustomerName"] });

export const systemsQuerySchema = z.object({ siteId: z.string().uuid("not a valid id").optional() });

export const createSystemSchema = z
  .object({
    siteId: z.string().uuid("not a valid id"),
    name: text(200),
    kind: optText(80),
    refrigerant: optText(40),
    factoryChargeKg: optNumber(0, 1000),
    lineSetFeet: optNumber(0.1, 1000),
    liquidOd: z.enum(TUBE_ODS).optional().nullable(),
    suctionOd: z.enum(TUBE_ODS).optional().nullable(),
    indoorCoilLitres: optNumber(0, 1000),
    outdoorUnitLitres: optNumber(0, 1000),
    installedOn: day.optional().nullable(),
  })
  .strict();

export const jobsQuerySchema = z.object({ siteId: z.string().uuid("not a valid id").optional() });

export const createJobSchema = z
  .object({
    visitedOn: day,
    siteId: z.string().uuid("not a valid id").optional().nullable(),
    systemId: z.string().uuid("not a valid id").optional().nullable(),
    technicianId: z.string().min(1).max(100).optional().nullable(),
    reason: optText(500),
    reference: optText(100),
  })
  .strict();

import { pgTable, text, timestamp, uuid, real, date, index, unique, foreignKey } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";

/** Customers, their sites, the systems at a site, and the visits (jobs) to them. */
export const customers = pgTable(
  "customers",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    email: text("email"),
    phone: text("phone"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("customers_org_idx").on(t.organizationId)],
);

export const sites = pgTable(
  "sites",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    customerId: uuid("customer_id").references(() => customers.id, { onDelete: "set null" }),
    name: text("name").notNull(),
    address: text("address"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("sites_org_idx").on(t.organizationId), unique("sites_org_id_key").on(t.organizationId, t.id)],
);

export const systems = pgTable(
  "systems",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    /** A site of the same organization (composite foreign key below). */
    siteId: uuid("site_id").notNull(),
    name: text("name").notNull(),
    kind: text("kind"),
    refrigerant: text("refrigerant"),
    factoryChargeKg: real("factory_charge_kg"),
    lineSetFeet: real("line_set_feet"),
    liquidOd: text("liquid_od"),
    suctionOd: text("suction_od"),
    indoorCoilLitres: real("indoor_coil_litres"),
    outdoorUnitLitres: real("outdoor_unit_litres"),
    installedOn: date("installed_on"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [
    index("systems_org_idx").on(t.organizationId),
    index("systems_site_idx").on(t.siteId),
    unique("systems_org_id_key").on(t.organizationId, t.id),
    foreignKey({ name: "systems_site_fk", columns: [t.organizationId, t.siteId], foreignColumns: [sites.organizationId, sites.id] }).onDelete("cascade"),
  ],
);

export const jobs = pgTable(
  "jobs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: text("organization_id").notNull().references(() => organization.id, { onDelete: "cascade" }),
    siteId: uuid("site_id").references(() => sites.id, { onDelete: "set null" }),
    systemId: uuid("system_id").references(() => systems.id, { onDelete: "set null" }),
    technicianId: text("technician_id").references(() => user.id, { onDelete: "set null" }),
    visitedOn: date("visited_on").notNull(),
    reason: text("reason"),
    reference: text("reference"),
    createdAt: timestamp("created_at", { withTimezone: true }).defaultNow().notNull(),
  },
  (t) => [index("jobs_org_idx").on(t.organizationId), unique("jobs_org_id_key").on(t.organizationId, t.id)],
);

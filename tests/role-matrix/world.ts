/**
 * One shop with a member of every role and something of every kind, plus an outsider (the owner
 * of another shop), made through the real routes where a person would make it. The role matrix
 * walks every route against it.
 */
import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { createTestShare } from "@/db/queries/visibility";
import { insertTask } from "@/db/queries/tasks";
import { ROLES, type Role } from "@/lib/permissions";
import { appRequest, createCrew, createShop, routeParams, uniqueEmail, type TestMember } from "../helpers/members";
import { sampleText, uploadRequest } from "../helpers/uploads";

export type Handler = (req: Request, ctx?: { params: Promise<Record<string, string>> }) => Promise<Response>;
export type Load = () => Promise<Record<string, unknown>>;

export const SAMPLE = "sample-1-iso-microns.csv";

/** Calls a route's handler as a member (or anonymous). */
export async function hit(load: Load, method: string, path: string, as: TestMember | null, opts: { body?: unknown; params?: Record<string, string>; form?: Request } = {}): Promise<Response> {
  const handler = (await load())[method] as Handler;
  const req =
    opts.form ??
    appRequest(path, {
      method,
      as,
      ...(opts.body !== undefined ? { body: JSON.stringify(opts.body), headers: { "content-type": "application/json" } } : {}),
    });
  return handler(req, routeParams(opts.params ?? {}));
}

async function json<T = Record<string, unknown>>(res: Response, want: number): Promise<T> {
  const text = await res.text();
  if (res.status !== want) throw new Error(`world setup: expected ${want}, got ${res.status}: ${text.slice(0, 300)}`);
  return JSON.parse(text) as T;
}

export interface World {
  crew: Record<Role, TestMember>;
  outsider: TestMember;
  customerId: string;
  customerEmail: string;
  siteId: string;
  siteName: string;
  systemId: string;
  jobId: string;
  /** A technician's uploaded test on the system (raw file stored). */
  techTestId: string;
  /** A trainer's practice test on the system, shared with the apprentice, not yet called. */
  practiceTestId: string;
  /** A practice test the apprentice has called; its call's id. */
  calledTestId: string;
  callId: string;
  collectionId: string;
  entryId: string;
  pinId: string;
  rigId: string;
  rigItemId: string;
  pressureTestId: string;
  profileId: string;
  /** A finished log task the technician started. */
  taskId: string;
  shareLinkId: string;
  /** Strings of this shop that must never appear in the outsider's answers. */
  secrets: string[];
}

const L = {
  tests: () => import("@/app/api/vacuum-tests/route"),
  call: () => import("@/app/api/practice/tests/[id]/call/route"),
  customers: () => import("@/app/api/customers/route"),
  sites: () => import("@/app/api/sites/route"),
  systems: () => import("@/app/api/systems/route"),
  jobs: () => import("@/app/api/jobs/route"),
  casebook: () => import("@/app/api/casebook/route"),
  entries: () => import("@/app/api/casebook/[id]/entries/route"),
  pins: () => import("@/app/api/casebook/[id]/entries/[entryId]/pins/route"),
  rigs: () => import("@/app/api/rigs/route"),
  rigItems: () => import("@/app/api/rigs/[id]/items/route"),
  pressure: () => import("@/app/api/pressure-tests/route"),
  profiles: () => import("@/app/api/settings/profiles/route"),
  shareLinks: () => import("@/app/api/vacuum-tests/[id]/share-links/route"),
};

/** A test uploaded through POST /api/vacuum-tests with a real gauge file. */
export async function uploadTest(as: TestMember, fields: Record<string, string> = {}): Promise<string> {
  const res = await hit(L.tests, "POST", "/api/vacuum-tests", as, { form: uploadRequest("/api/vacuum-tests", { as, file: { body: sampleText(SAMPLE), name: SAMPLE }, fields }) });
  return (await json<{ test: { id: string } }>(res, 201)).test.id;
}

export async function buildWorld(): Promise<World> {
  const crew = await createCrew();
  const outsider = await createShop("Outside Refrigeration");
  const { owner, technician, trainer, apprentice } = crew;
  const tag = randomUUID().slice(0, 6);
  const customerEmail = uniqueEmail("casey-customer");
  const siteName = `Hollow Pine Farm ${tag}`;

  const customer = await json<{ customer: { id: string } }>(await hit(L.customers, "POST", "/api/customers", owner, { body: { name: `Casey Customer ${tag}`, email: customerEmail, phone: "+1 555 0100" } }), 201);
  const site = await json<{ site: { id: string } }>(await hit(L.sites, "POST", "/api/sites", owner, { body: { name: siteName, customerId: customer.customer.id } }), 201);
  const system = await json<{ system: { id: string } }>(await hit(L.systems, "POST", "/api/systems", owner, { body: { siteId: site.site.id, name: `Barn heat pump ${tag}` } }), 201);
  const job = await json<{ job: { id: string } }>(await hit(L.jobs, "POST", "/api/jobs", owner, { body: { visitedOn: "2026-11-20", siteId: site.site.id } }), 201);

  const onSystem = { siteId: site.site.id, systemId: system.system.id };
  const techTestId = await uploadTest(technician, onSystem);
  const practiceTestId = await uploadTest(trainer, { ...onSystem, isPractice: "true", title: "Practice: barn heat pump" });
  const calledTestId = await uploadTest(trainer, { isPractice: "true", title: "Practice: called" });
  for (const id of [practiceTestId, calledTestId]) await createTestShare(db(), { organizationId: owner.organizationId, testId: id, userId: apprentice.userId });
  const called = await json<{ call: { id: string } }>(
    await hit(L.call, "POST", `/api/practice/tests/${calledTestId}/call`, apprentice, { body: { call: "pass", reason: "it settles low" }, params: { id: calledTestId } }),
    201,
  );

  const collection = await json<{ collection: { id: string } }>(await hit(L.casebook, "POST", "/api/casebook", trainer, { body: { title: `Curves ${tag}` } }), 201);
  const cid = collection.collection.id;
  const entry = await json<{ entry: { id: string } }>(await hit(L.entries, "POST", `/api/casebook/${cid}/entries`, trainer, { body: { testId: techTestId, title: "A leak" }, params: { id: cid } }), 201);
  const eid = entry.entry.id;
  const pin = await json<{ pin: { id: string } }>(await hit(L.pins, "POST", "/x", trainer, { body: { atSeconds: 60, text: "isolation" }, params: { id: cid, entryId: eid } }), 201);

  const rig = await json<{ rig: { id: string } }>(await hit(L.rigs, "POST", "/api/rigs", technician, { body: { name: `Truck 4 rig ${tag}` } }), 201);
  const item = await json<{ item: { id: string } }>(await hit(L.rigItems, "POST", "/x", technician, { body: { kind: "pump", label: "6 CFM pump" }, params: { id: rig.rig.id } }), 201);
  const pressure = await json<{ test: { id: string } }>(
    await hit(L.pressure, "POST", "/api/pressure-tests", technician, {
      body: { source: "typed", unit: "psig", start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 300, temperature: 70 }, durationMinutes: 30, temperatureUnit: "F" },
    }),
    201,
  );
  const profile = await json<{ profile: { id: string } }>(
    await hit(L.profiles, "POST", "/x", owner, { body: { name: `Strict ${tag}`, targetMicrons: 400, holdMinutes: 15, limitMicrons: 800, leakRateMicronsPerMinute: 15 } }),
    201,
  );
  const link = await json<{ id: string }>(await hit(L.shareLinks, "POST", "/x", owner, { body: {}, params: { id: techTestId } }), 201);
  const task = await insertTask(db(), {
    id: randomUUID(), organizationId: owner.organizationId, requestedById: technician.userId, kind: "log_analysis",
    state: "done", stage: "done", done: 1, input: {}, testId: techTestId,
  });

  return {
    crew, outsider, customerId: customer.customer.id, customerEmail, siteId: site.site.id, siteName, systemId: system.system.id, jobId: job.job.id,
    techTestId, practiceTestId, calledTestId, callId: called.call.id, collectionId: cid, entryId: eid, pinId: pin.pin.id,
    rigId: rig.rig.id, rigItemId: item.item.id, pressureTestId: pressure.test.id, profileId: profile.profile.id, shareLinkId: link.id, taskId: task.id,
    secrets: [owner.organizationId, techTestId, practiceTestId, customerEmail, siteName, site.site.id, system.system.id],
  };
}

export { ROLES };

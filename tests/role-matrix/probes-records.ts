/** Probes of the records, members, rigs, nitrogen-test and profile routes (see ../role-matrix.test.ts). */
import { addMember } from "../helpers/members";
import { rigCreators, rigManagers, rigSeers, rule, techTestReaders, type Probe } from "./expect";
import { hit, type World } from "./world";

const L = {
  customers: () => import("@/app/api/customers/route"),
  customer: () => import("@/app/api/customers/[id]/route"),
  sites: () => import("@/app/api/sites/route"),
  systems: () => import("@/app/api/systems/route"),
  system: () => import("@/app/api/systems/[id]/route"),
  jobs: () => import("@/app/api/jobs/route"),
  members: () => import("@/app/api/members/route"),
  member: () => import("@/app/api/members/[userId]/route"),
  invitations: () => import("@/app/api/members/invitations/route"),
  invitation: () => import("@/app/api/members/invitations/[id]/route"),
  rigs: () => import("@/app/api/rigs/route"),
  rig: () => import("@/app/api/rigs/[id]/route"),
  rigItems: () => import("@/app/api/rigs/[id]/items/route"),
  rigItem: () => import("@/app/api/rigs/[id]/items/[itemId]/route"),
  rigEvents: () => import("@/app/api/rigs/[id]/events/route"),
  rigByTest: () => import("@/app/api/rigs/by-test/[testId]/route"),
  pressureTests: () => import("@/app/api/pressure-tests/route"),
  pressureTest: () => import("@/app/api/pressure-tests/[id]/route"),
  profiles: () => import("@/app/api/profiles/route"),
  settingsProfiles: () => import("@/app/api/settings/profiles/route"),
  settingsProfile: () => import("@/app/api/settings/profiles/[id]/route"),
  profileDefault: () => import("@/app/api/settings/profiles/[id]/default/route"),
  profileReanalysis: () => import("@/app/api/settings/profiles/[id]/reanalysis/route"),
  task: () => import("@/app/api/tasks/[id]/route"),
  shopSettings: () => import("@/app/api/settings/shop/route"),
  unitSettings: () => import("@/app/api/settings/units/route"),
  myUnits: () => import("@/app/api/settings/units/mine/route"),
  plannerHistory: () => import("@/app/api/planner/history/route"),
  similarNames: () => import("@/app/api/records/similar/route"),
  mergeRecords: () => import("@/app/api/records/merge/route"),
};

async function twoSpareSites(w: World): Promise<{ fromId: string; intoId: string }> {
  const mk = async (name: string) => (await (await hit(L.sites, "POST", "/x", w.crew.owner, { body: { name } })).json()).site.id as string;
  return { fromId: await mk("Spare site (duplicate)"), intoId: await mk("Spare site") };
}

const profile = { name: "Matrix profile", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1000, leakRateMicronsPerMinute: 20 };

async function freshRig(w: World): Promise<string> {
  return (await (await hit(L.rigs, "POST", "/x", w.crew.technician, { body: { name: "Spare rig" } })).json()).rig.id;
}
async function freshRigItem(w: World): Promise<string> {
  return (await (await hit(L.rigItems, "POST", "/x", w.crew.technician, { body: { kind: "hose", label: "Spare hose" }, params: { id: w.rigId } })).json()).item.id;
}
async function freshProfile(w: World): Promise<string> {
  return (await (await hit(L.settingsProfiles, "POST", "/x", w.crew.owner, { body: { ...profile, name: `Spare ${Math.random()}` } })).json()).profile.id;
}
async function freshInvitation(w: World): Promise<string> {
  const email = `matrix-${Math.random().toString(36).slice(2)}@example.test`;
  return (await (await hit(L.invitations, "POST", "/x", w.crew.owner, { body: { email, role: "apprentice" } })).json()).invitation.id;
}

export const RECORD_PROBES: Probe[] = [
  { route: "GET /api/settings/shop", call: (as) => hit(L.shopSettings, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "PUT /api/settings/shop", call: (as) => hit(L.shopSettings, "PUT", "/x", as, { body: { timeZone: "America/Chicago" } }), expect: rule("members.manage"), outsider: "no-leak" },
  { route: "GET /api/settings/units", call: (as) => hit(L.unitSettings, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "PUT /api/settings/units", call: (as) => hit(L.unitSettings, "PUT", "/x", as, { body: { unitSystem: "imperial" } }), expect: rule("members.manage"), outsider: "no-leak" },
  { route: "PUT /api/settings/units/mine", call: (as) => hit(L.myUnits, "PUT", "/x", as, { body: { unitSystem: null } }), expect: rule("member"), outsider: "no-leak" },
  {
    route: "GET /api/planner/history",
    call: (as, w) => hit(L.plannerHistory, "GET", `/api/planner/history?systemId=${w.systemId}`, as),
    expect: rule("member"),
    outsider: 404,
  },
  { route: "GET /api/customers", call: (as) => hit(L.customers, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "POST /api/customers", call: (as) => hit(L.customers, "POST", "/x", as, { body: { name: "Matrix customer" } }), expect: rule("records.manage"), outsider: "no-leak" },
  { route: "GET /api/customers/:id", call: (as, w) => hit(L.customer, "GET", "/x", as, { params: { id: w.customerId } }), expect: rule("member"), outsider: 404 },
  { route: "GET /api/sites", call: (as) => hit(L.sites, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  {
    route: "POST /api/sites",
    call: (as, w) => hit(L.sites, "POST", "/x", as, { body: { name: "Matrix site", customerId: w.customerId } }),
    expect: rule("records.manage"),
    outsider: 400, // another shop's customer is not theirs to name
  },
  { route: "GET /api/systems", call: (as) => hit(L.systems, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "POST /api/systems", call: (as, w) => hit(L.systems, "POST", "/x", as, { body: { siteId: w.siteId, name: "Matrix system" } }), expect: rule("records.manage"), outsider: 400 },
  { route: "GET /api/systems/:id", call: (as, w) => hit(L.system, "GET", "/x", as, { params: { id: w.systemId } }), expect: rule("member"), outsider: 404 },
  {
    route: "GET /api/records/similar",
    call: (as) => hit(L.similarNames, "GET", "/api/records/similar?kind=site&name=Matrix%20site", as),
    expect: rule("records.manage"),
    outsider: "no-leak",
  },
  {
    route: "POST /api/records/merge",
    call: async (as, w) => hit(L.mergeRecords, "POST", "/x", as, { body: { kind: "site", ...(await twoSpareSites(w)) } }),
    expect: rule("records.manage"),
    outsider: 404,
  },
  { route: "GET /api/jobs", call: (as) => hit(L.jobs, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "POST /api/jobs", call: (as, w) => hit(L.jobs, "POST", "/x", as, { body: { visitedOn: "2026-11-21", siteId: w.siteId } }), expect: rule("records.manage"), outsider: 400 },

  { route: "GET /api/members", call: (as) => hit(L.members, "GET", "/x", as), expect: rule("members.read"), outsider: "no-leak" },
  {
    route: "PATCH /api/members/:userId",
    call: (as, w) => hit(L.member, "PATCH", "/x", as, { body: { role: "apprentice" }, params: { userId: w.crew.apprentice.userId } }),
    expect: rule("members.manage"),
    outsider: 404,
  },
  {
    route: "DELETE /api/members/:userId",
    call: async (as, w) => {
      const spare = await addMember(w.crew.owner.organizationId, "apprentice", "Spare Apprentice");
      return hit(L.member, "DELETE", "/x", as, { params: { userId: spare.userId } });
    },
    expect: rule("members.manage"),
    outsider: 404,
  },
  { route: "GET /api/members/invitations", call: (as) => hit(L.invitations, "GET", "/x", as), expect: rule("members.manage"), outsider: "no-leak" },
  {
    route: "POST /api/members/invitations",
    call: (as) => hit(L.invitations, "POST", "/x", as, { body: { email: `inv-${Math.random().toString(36).slice(2)}@example.test`, role: "technician" } }),
    expect: rule("members.manage"),
    outsider: "no-leak",
  },
  {
    route: "DELETE /api/members/invitations/:id",
    call: async (as, w) => hit(L.invitation, "DELETE", "/x", as, { params: { id: await freshInvitation(w) } }),
    expect: rule("members.manage"),
    outsider: 404,
  },

  { route: "GET /api/rigs", call: (as) => hit(L.rigs, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "POST /api/rigs", call: (as) => hit(L.rigs, "POST", "/x", as, { body: { name: "Matrix rig" } }), expect: rule("member", { may: rigCreators }), outsider: "no-leak" },
  { route: "GET /api/rigs/:id", call: (as, w) => hit(L.rig, "GET", "/x", as, { params: { id: w.rigId } }), expect: rule("member", { visible: rigSeers }), outsider: 404 },
  {
    route: "PATCH /api/rigs/:id",
    call: (as, w) => hit(L.rig, "PATCH", "/x", as, { body: { notes: "serviced" }, params: { id: w.rigId } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  {
    route: "DELETE /api/rigs/:id",
    call: async (as, w) => hit(L.rig, "DELETE", "/x", as, { params: { id: await freshRig(w) } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  { route: "GET /api/rigs/:id/items", call: (as, w) => hit(L.rigItems, "GET", "/x", as, { params: { id: w.rigId } }), expect: rule("member", { visible: rigSeers }), outsider: 404 },
  {
    route: "POST /api/rigs/:id/items",
    call: (as, w) => hit(L.rigItems, "POST", "/x", as, { body: { kind: "gauge", label: "Micron gauge" }, params: { id: w.rigId } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  {
    route: "PATCH /api/rigs/:id/items/:itemId",
    call: (as, w) => hit(L.rigItem, "PATCH", "/x", as, { body: { label: "6 CFM pump (rebuilt)" }, params: { id: w.rigId, itemId: w.rigItemId } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  {
    route: "DELETE /api/rigs/:id/items/:itemId",
    call: async (as, w) => hit(L.rigItem, "DELETE", "/x", as, { params: { id: w.rigId, itemId: await freshRigItem(w) } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  { route: "GET /api/rigs/:id/events", call: (as, w) => hit(L.rigEvents, "GET", "/x", as, { params: { id: w.rigId } }), expect: rule("member", { visible: rigSeers }), outsider: 404 },
  {
    route: "POST /api/rigs/:id/events",
    call: (as, w) => hit(L.rigEvents, "POST", "/x", as, { body: { kind: "gauge_cleaned", occurredOn: "2026-11-22" }, params: { id: w.rigId } }),
    expect: rule("member", { visible: rigSeers, may: rigManagers }),
    outsider: 404,
  },
  {
    route: "GET /api/rigs/by-test/:testId",
    call: (as, w) => hit(L.rigByTest, "GET", "/x", as, { params: { testId: w.techTestId } }),
    expect: rule("member", { visible: techTestReaders }),
    outsider: 404,
  },
  {
    route: "PUT /api/rigs/by-test/:testId",
    call: (as, w) => hit(L.rigByTest, "PUT", "/x", as, { body: { rigId: w.rigId }, params: { testId: w.techTestId } }),
    // The test must be visible, and the rig too.
    expect: rule("member", { visible: techTestReaders.filter((r) => rigSeers.includes(r)) }),
    outsider: 404,
  },

  { route: "GET /api/pressure-tests", call: (as) => hit(L.pressureTests, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  {
    route: "POST /api/pressure-tests",
    call: (as) =>
      hit(L.pressureTests, "POST", "/x", as, {
        body: { source: "typed", unit: "psig", start: { pressureGauge: 250, temperature: 68 }, end: { pressureGauge: 249, temperature: 68 }, durationMinutes: 20, temperatureUnit: "F" },
      }),
    expect: rule("tests.upload"),
    outsider: "no-leak",
  },
  {
    route: "GET /api/pressure-tests/:id",
    call: (as, w) => hit(L.pressureTest, "GET", "/x", as, { params: { id: w.pressureTestId } }),
    expect: rule("member", { visible: techTestReaders }), // visible like vacuum tests
    outsider: 404,
  },

  { route: "GET /api/profiles", call: (as) => hit(L.profiles, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  { route: "GET /api/settings/profiles", call: (as) => hit(L.settingsProfiles, "GET", "/x", as), expect: rule("profiles.manage"), outsider: "no-leak" },
  { route: "POST /api/settings/profiles", call: (as) => hit(L.settingsProfiles, "POST", "/x", as, { body: profile }), expect: rule("profiles.manage"), outsider: "no-leak" },
  {
    route: "PUT /api/settings/profiles/:id",
    call: (as, w) => hit(L.settingsProfile, "PUT", "/x", as, { body: { ...profile, name: "Strict (edited)" }, params: { id: w.profileId } }),
    expect: rule("profiles.manage"),
    outsider: 404,
  },
  {
    route: "DELETE /api/settings/profiles/:id",
    call: async (as, w) => hit(L.settingsProfile, "DELETE", "/x", as, { params: { id: await freshProfile(w) } }),
    expect: rule("profiles.manage", { ok: "passes" }), // the default profile answers 409
    outsider: 404,
  },
  {
    route: "POST /api/settings/profiles/:id/default",
    call: (as, w) => hit(L.profileDefault, "POST", "/x", as, { params: { id: w.profileId } }),
    expect: rule("profiles.manage"),
    outsider: 404,
  },
  {
    route: "POST /api/settings/profiles/:id/reanalysis",
    // A profile no test was judged by: 200 { task: null }, nothing re-checked in the shared world.
    call: async (as, w) => hit(L.profileReanalysis, "POST", "/x", as, { body: {}, params: { id: await freshProfile(w) } }),
    expect: rule("profiles.manage"),
    outsider: 404,
  },
  {
    // The technician's own task; those who read every test see it too.
    route: "GET /api/tasks/:id",
    call: (as, w) => hit(L.task, "GET", "/x", as, { params: { id: w.taskId } }),
    expect: rule("member", { visible: techTestReaders }),
    outsider: 404,
  },
];

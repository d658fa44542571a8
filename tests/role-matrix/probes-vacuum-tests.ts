/** Probes of the vacuum-test, review, report, practice and casebook routes (see ../role-matrix.test.ts). */
import { ROLES, can, type Role } from "@/lib/permissions";
import { uploadRequest, sampleText } from "../helpers/uploads";
import { callReaders, only, practiceReaders, rule, techTestReaders, type Probe } from "./expect";
import { hit, SAMPLE, type World } from "./world";

const L = {
  tests: () => import("@/app/api/vacuum-tests/route"),
  test: () => import("@/app/api/vacuum-tests/[id]/route"),
  analyses: () => import("@/app/api/vacuum-tests/[id]/analyses/route"),
  comments: () => import("@/app/api/vacuum-tests/[id]/comments/route"),
  emailReport: () => import("@/app/api/vacuum-tests/[id]/email-report/route"),
  events: () => import("@/app/api/vacuum-tests/[id]/events/route"),
  raw: () => import("@/app/api/vacuum-tests/[id]/raw/route"),
  report: () => import("@/app/api/vacuum-tests/[id]/report/route"),
  retests: () => import("@/app/api/vacuum-tests/[id]/retests/route"),
  review: () => import("@/app/api/vacuum-tests/[id]/review/route"),
  shareLinks: () => import("@/app/api/vacuum-tests/[id]/share-links/route"),
  shareLink: () => import("@/app/api/vacuum-tests/[id]/share-links/[linkId]/route"),
  preview: () => import("@/app/api/imports/preview/route"),
  overlay: () => import("@/app/api/overlay/route"),
  reviewQueue: () => import("@/app/api/review/route"),
  outbox: () => import("@/app/api/outbox/route"),
  resend: () => import("@/app/api/outbox/resend/route"),
  practiceTests: () => import("@/app/api/practice/tests/route"),
  practiceTest: () => import("@/app/api/practice/tests/[id]/route"),
  practiceCall: () => import("@/app/api/practice/tests/[id]/call/route"),
  practiceCalls: () => import("@/app/api/practice/calls/route"),
  callComments: () => import("@/app/api/practice/calls/[id]/comments/route"),
  casebook: () => import("@/app/api/casebook/route"),
  collection: () => import("@/app/api/casebook/[id]/route"),
  entries: () => import("@/app/api/casebook/[id]/entries/route"),
  entry: () => import("@/app/api/casebook/[id]/entries/[entryId]/route"),
  pins: () => import("@/app/api/casebook/[id]/entries/[entryId]/pins/route"),
  pin: () => import("@/app/api/casebook/[id]/entries/[entryId]/pins/[pinId]/route"),
};

const typed = { timeMode: "minutes", readings: Array.from({ length: 12 }, (_, i) => ({ time: i, microns: 350 + 5 * i })) };
const onTech = (w: World) => ({ id: w.techTestId });
const mayReanalyse = (r: Role) => r === "owner" || r === "lead" || r === "technician"; // lib/vacuum-tests/analyse.ts: owners, leads, the test's technician
const mayWriteNote = (r: Role) => r === "technician" || can(r, "reports.share"); // lib/vacuum-tests/customer-note.ts: the test's technician, leads, the owner
const mayRetest = (r: Role) => r === "technician" || can(r, "tests.review"); // lib/review/retest.ts

/** A fresh object to delete per call, so each role meets one that exists. */
async function freshCollection(w: World): Promise<string> {
  const res = await hit(L.casebook, "POST", "/api/casebook", w.crew.trainer, { body: { title: "To delete" } });
  return (await res.json()).collection.id;
}
async function freshEntry(w: World): Promise<string> {
  const res = await hit(L.entries, "POST", "/x", w.crew.trainer, { body: { testId: w.techTestId, title: "To delete" }, params: { id: w.collectionId } });
  return (await res.json()).entry.id;
}
async function freshPin(w: World): Promise<string> {
  const res = await hit(L.pins, "POST", "/x", w.crew.trainer, { body: { atSeconds: 30, text: "to delete" }, params: { id: w.collectionId, entryId: w.entryId } });
  return (await res.json()).pin.id;
}
async function freshShareLink(w: World): Promise<string> {
  const res = await hit(L.shareLinks, "POST", "/x", w.crew.owner, { body: {}, params: onTech(w) });
  return (await res.json()).id;
}

export const TEST_PROBES: Probe[] = [
  { route: "GET /api/vacuum-tests", call: (as) => hit(L.tests, "GET", "/api/vacuum-tests", as), expect: rule("member"), outsider: "no-leak" },
  { route: "POST /api/vacuum-tests", call: (as) => hit(L.tests, "POST", "/api/vacuum-tests", as, { body: typed }), expect: rule("tests.upload"), outsider: "no-leak" },
  {
    route: "GET /api/vacuum-tests/:id",
    call: (as, w) => hit(L.test, "GET", `/api/vacuum-tests/${w.techTestId}`, as, { params: onTech(w) }),
    expect: rule("member", { visible: techTestReaders }),
    outsider: 404,
  },
  {
    route: "PATCH /api/vacuum-tests/:id",
    call: (as, w) => hit(L.test, "PATCH", "/x", as, { body: { customerNote: "Thank you for your patience." }, params: onTech(w) }),
    expect: rule("member", { visible: techTestReaders, may: only(ROLES.filter(mayWriteNote)) }),
    outsider: 404,
  },
  {
    route: "POST /api/vacuum-tests/:id/analyses",
    call: (as, w) => hit(L.analyses, "POST", "/x", as, { body: { reason: "matrix" }, params: onTech(w) }),
    expect: rule("tests.reanalyse", { visible: techTestReaders, may: only(techTestReaders.filter(mayReanalyse)) }),
    outsider: 404,
  },
  { route: "GET /api/vacuum-tests/:id/comments", call: (as, w) => hit(L.comments, "GET", "/x", as, { params: onTech(w) }), expect: rule("tests.comment", { visible: techTestReaders }), outsider: 404 },
  {
    route: "POST /api/vacuum-tests/:id/comments",
    call: (as, w) => hit(L.comments, "POST", "/x", as, { body: { body: "looks tight" }, params: onTech(w) }),
    expect: rule("tests.comment", { visible: techTestReaders }),
    outsider: 404,
  },
  {
    route: "POST /api/vacuum-tests/:id/email-report",
    call: (as, w) => hit(L.emailReport, "POST", "/x", as, { body: { to: "office@example.test" }, params: onTech(w) }),
    expect: rule("reports.share", { visible: techTestReaders }),
    outsider: 404,
  },
  { route: "GET /api/vacuum-tests/:id/events", call: (as, w) => hit(L.events, "GET", "/x", as, { params: onTech(w) }), expect: rule("member", { visible: techTestReaders }), outsider: 404 },
  { route: "GET /api/vacuum-tests/:id/raw", call: (as, w) => hit(L.raw, "GET", "/x", as, { params: onTech(w) }), expect: rule("member", { visible: techTestReaders }), outsider: 404 },
  { route: "GET /api/vacuum-tests/:id/report", call: (as, w) => hit(L.report, "GET", "/x", as, { params: onTech(w) }), expect: rule("member", { visible: techTestReaders }), outsider: 404 },
  {
    route: "POST /api/vacuum-tests/:id/retests",
    call: (as, w) => hit(L.retests, "POST", "/x", as, { form: uploadRequest("/x", { as, file: { body: sampleText(SAMPLE), name: SAMPLE } }), params: onTech(w) }),
    // Not sent back, so an allowed caller meets 409: the role and row checks come first.
    expect: rule("tests.upload", { visible: techTestReaders, may: only(techTestReaders.filter(mayRetest)), ok: "passes" }),
    outsider: 404,
  },
  { route: "GET /api/vacuum-tests/:id/review", call: (as, w) => hit(L.review, "GET", "/x", as, { params: onTech(w) }), expect: rule("member", { visible: techTestReaders }), outsider: 404 },
  {
    route: "POST /api/vacuum-tests/:id/review",
    call: (as, w) => hit(L.review, "POST", "/x", as, { body: { action: "sign_off" }, params: onTech(w) }),
    expect: rule("member", { visible: techTestReaders, may: only(techTestReaders.filter((r) => can(r, "tests.review"))), ok: "passes" }),
    outsider: 404,
  },
  { route: "GET /api/vacuum-tests/:id/share-links", call: (as, w) => hit(L.shareLinks, "GET", "/x", as, { params: onTech(w) }), expect: rule("reports.share", { visible: techTestReaders }), outsider: 404 },
  { route: "POST /api/vacuum-tests/:id/share-links", call: (as, w) => hit(L.shareLinks, "POST", "/x", as, { body: {}, params: onTech(w) }), expect: rule("reports.share", { visible: techTestReaders }), outsider: 404 },
  {
    route: "DELETE /api/vacuum-tests/:id/share-links/:linkId",
    call: async (as, w) => hit(L.shareLink, "DELETE", "/x", as, { params: { id: w.techTestId, linkId: await freshShareLink(w) } }),
    expect: rule("reports.share", { visible: techTestReaders }),
    outsider: 404,
  },
  {
    route: "POST /api/imports/preview",
    call: (as) => hit(L.preview, "POST", "/x", as, { form: uploadRequest("/x", { as, file: { body: sampleText(SAMPLE), name: SAMPLE } }) }),
    expect: rule("tests.upload"),
    outsider: "no-leak",
  },
  { route: "GET /api/overlay", call: (as, w) => hit(L.overlay, "GET", `/api/overlay?tests=${w.techTestId}`, as), expect: rule("member", { visible: techTestReaders }), outsider: 404 },
  { route: "GET /api/review", call: (as) => hit(L.reviewQueue, "GET", "/api/review", as), expect: rule("tests.review"), outsider: "no-leak" },
  { route: "GET /api/outbox", call: (as) => hit(L.outbox, "GET", "/api/outbox", as), expect: rule("tests.review"), outsider: "no-leak" },
  { route: "POST /api/outbox/resend", call: (as) => hit(L.resend, "POST", "/x", as, { body: {} }), expect: rule("tests.review"), outsider: "no-leak" },
  { route: "GET /api/practice/tests", call: (as) => hit(L.practiceTests, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  {
    route: "GET /api/practice/tests/:id",
    call: (as, w) => hit(L.practiceTest, "GET", "/x", as, { params: { id: w.practiceTestId } }),
    expect: rule("member", { visible: practiceReaders }),
    outsider: 404,
  },
  {
    route: "POST /api/practice/tests/:id/call",
    // Only apprentices make calls (403 for anyone else, before visibility); the apprentice's first call stands.
    call: (as, w) => hit(L.practiceCall, "POST", "/x", as, { body: { call: "leak", reason: "keeps climbing" }, params: { id: w.calledTestId } }),
    expect: (r) => (r === "apprentice" ? "passes" : 403),
    outsider: 403,
  },
  { route: "GET /api/practice/calls", call: (as) => hit(L.practiceCalls, "GET", "/x", as), expect: rule("member"), outsider: "no-leak" },
  {
    route: "POST /api/practice/calls/:id/comments",
    call: (as, w) => hit(L.callComments, "POST", "/x", as, { body: { body: "good reasoning" }, params: { id: w.callId } }),
    expect: rule("member", { visible: callReaders }),
    outsider: 404,
  },
  { route: "GET /api/casebook", call: (as) => hit(L.casebook, "GET", "/x", as), expect: rule("casebook.read"), outsider: "no-leak" },
  { route: "POST /api/casebook", call: (as) => hit(L.casebook, "POST", "/x", as, { body: { title: "Matrix" } }), expect: rule("casebook.curate"), outsider: 403 },
  { route: "GET /api/casebook/:id", call: (as, w) => hit(L.collection, "GET", "/x", as, { params: { id: w.collectionId } }), expect: rule("casebook.read"), outsider: 404 },
  {
    route: "PATCH /api/casebook/:id",
    call: (as, w) => hit(L.collection, "PATCH", "/x", as, { body: { description: "renamed" }, params: { id: w.collectionId } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "DELETE /api/casebook/:id",
    call: async (as, w) => hit(L.collection, "DELETE", "/x", as, { params: { id: await freshCollection(w) } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "POST /api/casebook/:id/entries",
    call: (as, w) => hit(L.entries, "POST", "/x", as, { body: { testId: w.techTestId, title: "Again" }, params: { id: w.collectionId } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "PATCH /api/casebook/:id/entries/:entryId",
    call: (as, w) => hit(L.entry, "PATCH", "/x", as, { body: { notes: "see the knee" }, params: { id: w.collectionId, entryId: w.entryId } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "DELETE /api/casebook/:id/entries/:entryId",
    call: async (as, w) => hit(L.entry, "DELETE", "/x", as, { params: { id: w.collectionId, entryId: await freshEntry(w) } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "POST /api/casebook/:id/entries/:entryId/pins",
    call: (as, w) => hit(L.pins, "POST", "/x", as, { body: { atSeconds: 90, text: "knee" }, params: { id: w.collectionId, entryId: w.entryId } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
  {
    route: "DELETE /api/casebook/:id/entries/:entryId/pins/:pinId",
    call: async (as, w) => hit(L.pin, "DELETE", "/x", as, { params: { id: w.collectionId, entryId: w.entryId, pinId: await freshPin(w) } }),
    expect: rule("casebook.curate"),
    outsider: 403,
  },
];

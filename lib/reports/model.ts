/**
 * Everything a test's report shows, as plain data: the printable page, the share page, the PDF and
 * the report e-mail are all drawn from this one model, and its numbers and statements from the
 * test's own story (lib/verdict/story.ts), so none of them can disagree with the test page.
 * The report is the customer's and the warranty desk's copy: it carries the note for the customer
 * and never the internal notes.
 */
import type { Db } from "@/db/client";
import { getAnalysisById } from "@/db/queries/analyses";
import { getSiteById, getSystemById } from "@/db/queries/records";
import { getOrganizationNameById, listReviewEventsByTest } from "@/db/queries/review";
import { getRigByTest, listRigEventsByRig, listRigItemsByRig } from "@/db/queries/rigs";
import { getOrganizationTimeZoneById } from "@/db/queries/settings";
import { getTestById, getUploadByTest } from "@/db/queries/vacuum-tests";
import type { AcceptanceProfile, AnalysisResult, Finding } from "@/analysis/decay/types";
import { bucketExtremes } from "@/analysis/shared/downsample";
import type { TestStatus } from "@/db/schema";
import { storyOf, type Story } from "@/lib/verdict/story";
import { RULE_LABELS } from "@/lib/verdict/words";
import { equipmentLines, type EquipmentLine } from "./equipment";
import { reviewStoryOf, type ReviewStory } from "./review-story";
import { dayInZone, whenInZone } from "./time";
import { REPORT_CAUTIONS } from "./words";
import type { UnitSystem } from "@/lib/units/convert";
import { lengthWords, temperatureWords } from "@/lib/units/format";
import { unitSettingsOf } from "@/lib/units/settings";

export interface ReportCurve {
  /** Minutes from the first data row. */
  xMinutes: number[];
  microns: number[];
  isolationMinutes: number | null;
  hold: { startMinutes: number; endMinutes: number } | null;
  limitMicrons: number;
  targetMicrons: number;
}

export interface ReportModel {
  testId: string;
  organizationName: string;
  /** The shop's IANA time zone; every time below is written in it. */
  timeZone: string;
  title: string;
  status: TestStatus;
  testedAt: string;
  /** "March 3, 2026 at 2:05 PM CST". */
  testedAtWords: string;
  /** YYYY-MM-DD on the shop's calendar. */
  testedOn: string;
  technicianName: string;
  customerName: string | null;
  siteName: string | null;
  siteAddress: string | null;
  system: { name: string; kind: string | null; refrigerant: string | null; lineSetFeet: number | null; liquidOd: string | null; suctionOd: string | null } | null;
  refrigerant: string | null;
  /** The job's facts: line set, volume, ambient, as [label, value] rows (only those given). */
  conditions: [string, string][];
  rig: { name: string; truck: string | null; pieces: EquipmentLine[] } | null;
  rigNote: string | null;
  /** The note for the customer; internal notes are never in the model. */
  customerNote: string | null;
  isPractice: boolean;
  verdict: string | null;
  /** The two statements and the numbers, from the analysis (null: not analysed). */
  story: Story | null;
  /** Kept for callers of the earlier model: the curve's headline. */
  verdictWords: string;
  confidence: number | null;
  numbers: { label: string; value: string; definition: string }[];
  profile: AcceptanceProfile | null;
  meetsProfile: boolean | null;
  profileRules: { label: string; met: boolean; detail: string }[];
  findings: Pick<Finding, "title" | "message" | "severity" | "checks">[];
  review: ReviewStory;
  curve: ReportCurve | null;
  cautions: readonly string[];
  engineVersion: string | null;
  calibration: string | null;
  raw: { filename: string; sha256: string; sizeBytes: number } | null;
}

/** Most points the report draws; min/max per bucket keeps spikes and the lowest point. */
const REPORT_POINTS = 600;

function thin(t: number[], p: number[]): { x: number[]; y: number[] } {
  const n = Math.min(t.length, p.length);
  if (n <= REPORT_POINTS) return { x: t.slice(0, n).map((s) => s / 60), y: p.slice(0, n) };
  const x: number[] = [];
  const y: number[] = [];
  bucketExtremes(p, n, REPORT_POINTS / 2, (lo, hi) => {
    for (const i of lo <= hi ? [lo, hi] : [hi, lo]) {
      x.push(t[i] / 60);
      y.push(p[i]);
    }
  });
  return { x, y };
}

const fmt = (v: number, digits = 0) => v.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: digits });

/** The report's numbers: the pull-down and isolation, then the story's hold numbers (each once). */
function numbersOf(r: AnalysisResult, story: Story): ReportModel["numbers"] {
  const out: ReportModel["numbers"] = [];
  const pd = r.phases?.pulldown;
  if (pd) out.push({ label: "Lowest before isolating", value: `${fmt(pd.lowestMicrons)} microns`, definition: "the lowest reading of the pull-down (3-reading median)" });
  if (r.isolationAt != null) out.push({ label: "Isolated at", value: `${fmt(r.isolationAt / 60, 1)} min into the log`, definition: "when the pump was valved off" });
  for (const n of story.numbers) {
    const value = n.value.replace(/ µ\/min$/, " microns/min").replace(/ µ$/, " microns");
    const beside = n.beside && n.beside.value !== n.value ? ` (single highest reading ${n.beside.value.replace(/ µ$/, " microns")})` : "";
    out.push({ label: n.label, value: value + beside, definition: n.definition });
  }
  if (r.leakRate) out.push({ label: "Leak rate", value: `${r.leakRate.mbarLitresPerSecond.toExponential(2)} mbar·L/s (volume ${fmt(r.leakRate.volumeLitres, 1)} L)`, definition: "the steady climb times the system volume" });
  return out;
}

function curveOf(series: { t: number[]; p: number[] }, r: AnalysisResult): ReportCurve {
  const { x, y } = thin(series.t, series.p);
  const holds = r.phases?.holds ?? r.holds ?? [];
  const primary = r.phases?.primary != null ? holds[r.phases.primary] : holds[holds.length - 1];
  return {
    xMinutes: x,
    microns: y,
    isolationMinutes: r.isolationAt != null ? r.isolationAt / 60 : null,
    hold: primary ? { startMinutes: primary.isolatedAtSeconds / 60, endMinutes: primary.endSeconds / 60 } : null,
    limitMicrons: r.profile.limitMicrons,
    targetMicrons: r.profile.targetMicrons,
  };
}

function conditionsOf(t: { lineSetFeet: number | null; liquidOd: string | null; suctionOd: string | null; volumeLitres: number | null; ambientC: number | null }, system: ReportModel["system"], units: UnitSystem): [string, string][] {
  const out: [string, string][] = [];
  const feet = t.lineSetFeet ?? system?.lineSetFeet ?? null;
  if (feet) out.push(["Line set", `${lengthWords(feet, units)}, ${t.liquidOd ?? system?.liquidOd ?? "?"} in. liquid / ${t.suctionOd ?? system?.suctionOd ?? "?"} in. suction`]);
  if (t.volumeLitres != null) out.push(["System volume", `${fmt(t.volumeLitres, 1)} L (${fmt(t.volumeLitres * 0.0353147, 2)} cu ft)`]);
  if (t.ambientC != null) out.push(["Ambient temperature", temperatureWords(t.ambientC, units)]);
  return out;
}

/**
 * The report of one test of the organization, or null when there is none. The caller has
 * already decided the reader may see it (a member who can see the test, or a valid share link).
 */
export async function buildReportModel(db: Db, params: { organizationId: string; testId: string }): Promise<ReportModel | null> {
  const org = params.organizationId;
  // Read as the organization (the caller checked access): the owner's view of the test.
  const owner = { organizationId: org, userId: "", role: "owner" as const };
  const row = await getTestById(db, { viewer: owner, testId: params.testId });
  if (!row) return null;
  const t = row.test;
  // The report is the shop's document: it is written in the shop's units (not the reader's own).
  const [orgName, timeZone, analysis, site, system, events, rig, upload, { shop: units }] = await Promise.all([
    getOrganizationNameById(db, { organizationId: org }),
    getOrganizationTimeZoneById(db, { organizationId: org }),
    t.currentAnalysisId ? getAnalysisById(db, { organizationId: org, analysisId: t.currentAnalysisId }) : null,
    t.siteId ? getSiteById(db, { organizationId: org, siteId: t.siteId }) : null,
    t.systemId ? getSystemById(db, { organizationId: org, systemId: t.systemId }) : null,
    listReviewEventsByTest(db, { organizationId: org, testId: t.id }),
    getRigByTest(db, { viewer: owner, testId: t.id }),
    getUploadByTest(db, { organizationId: org, testId: t.id }),
    unitSettingsOf(db, { organizationId: org, userId: "" }),
  ]);
  const testedOn = dayInZone(t.testedAt, timeZone);
  const [items, rigEvents] = rig
    ? await Promise.all([listRigItemsByRig(db, { organizationId: org, rigId: rig.id }), listRigEventsByRig(db, { organizationId: org, rigId: rig.id, limit: 500 })])
    : [[], []];
  const r = analysis?.result ?? null;
  const story = r ? storyOf(r) : null;
  const sys = system
    ? { name: system.name, kind: system.kind, refrigerant: system.refrigerant, lineSetFeet: system.lineSetFeet, liquidOd: system.liquidOd, suctionOd: system.suctionOd }
    : null;
  return {
    testId: t.id,
    organizationName: orgName ?? "",
    timeZone,
    title: t.title,
    status: t.status,
    testedAt: t.testedAt.toISOString(),
    testedAtWords: whenInZone(t.testedAt, timeZone),
    testedOn,
    technicianName: row.createdByName,
    customerName: site?.customerName ?? null,
    siteName: site?.name ?? null,
    siteAddress: site?.address ?? null,
    system: sys,
    refrigerant: t.refrigerant ?? system?.refrigerant ?? null,
    conditions: conditionsOf(t, sys, units),
    rig: rig ? { name: rig.name, truck: rig.truck, pieces: equipmentLines(items, rigEvents, testedOn) } : null,
    rigNote: t.rigNote,
    customerNote: t.customerNote,
    isPractice: t.isPractice,
    verdict: r?.verdict ?? null,
    story,
    verdictWords: story?.curve.headline ?? "not analysed",
    confidence: r?.confidence ?? null,
    numbers: r && story ? numbersOf(r, story) : [],
    profile: analysis?.profile ?? null,
    meetsProfile: r?.meetsProfile ?? null,
    profileRules: (r?.profileRules ?? []).map((x) => ({ label: storyRuleLabel(x.rule), met: x.met, detail: x.detail })),
    findings: (r?.findings ?? []).map((f) => ({ title: f.title, message: f.message, severity: f.severity, checks: f.checks })),
    review: reviewStoryOf(t.status, events, timeZone),
    curve: analysis && r ? curveOf(analysis.series, r) : null,
    cautions: REPORT_CAUTIONS,
    engineVersion: r?.engineVersion ?? null,
    calibration: r?.certainty?.calibration ?? null,
    raw: upload ? { filename: upload.filename, sha256: upload.sha256, sizeBytes: upload.sizeBytes } : null,
  };
}

function storyRuleLabel(rule: keyof typeof RULE_LABELS): string {
  return RULE_LABELS[rule] ?? rule;
}

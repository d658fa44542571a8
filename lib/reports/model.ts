/**
 * Everything a test's report shows, as plain data: the printable page, the share page and the
 * PDF are all drawn from this one model, so they never disagree.
 */
import type { Db } from "@/db/client";
import { getAnalysisById } from "@/db/queries/analyses";
import { getSiteById, getSystemById } from "@/db/queries/records";
import { getLatestSignOffByTest, getOrganizationNameById } from "@/db/queries/review";
import { getTestById } from "@/db/queries/tests";
import type { AcceptanceProfile, AnalysisResult, Finding } from "@/analysis/types";
import type { TestStatus } from "@/db/schema";
import { RULE_LABELS } from "@/components/verdict/words";
import { REPORT_CAUTIONS, verdictLabel } from "./words";

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
  title: string;
  status: TestStatus;
  testedAt: string;
  technicianName: string;
  customerName: string | null;
  siteName: string | null;
  siteAddress: string | null;
  system: { name: string; kind: string | null; refrigerant: string | null; lineSetFeet: number | null; liquidOd: string | null; suctionOd: string | null } | null;
  refrigerant: string | null;
  rigNote: string | null;
  notes: string | null;
  isPractice: boolean;
  verdict: string | null;
  verdictWords: string;
  confidence: number | null;
  numbers: { label: string; value: string }[];
  profile: AcceptanceProfile | null;
  meetsProfile: boolean | null;
  profileRules: { label: string; met: boolean; detail: string }[];
  findings: Pick<Finding, "title" | "message" | "severity" | "checks">[];
  signOff: { by: string; at: string; note: string | null } | null;
  curve: ReportCurve | null;
  cautions: readonly string[];
  engineVersion: string | null;
}

/** Most points the report draws; min/max per bucket keeps spikes and the lowest point. */
const REPORT_POINTS = 600;

function thin(t: number[], p: number[]): { x: number[]; y: number[] } {
  const n = Math.min(t.length, p.length);
  if (n <= REPORT_POINTS) return { x: t.slice(0, n).map((s) => s / 60), y: p.slice(0, n) };
  const x: number[] = [];
  const y: number[] = [];
  const buckets = REPORT_POINTS / 2;
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor((b * n) / buckets);
    const to = Math.floor(((b + 1) * n) / buckets);
    let lo = from;
    let hi = from;
    for (let i = from; i < to; i++) {
      if (p[i] < p[lo]) lo = i;
      if (p[i] > p[hi]) hi = i;
    }
    for (const i of lo <= hi ? [lo, hi] : [hi, lo]) {
      x.push(t[i] / 60);
      y.push(p[i]);
    }
  }
  return { x, y };
}

const fmt = (v: number, digits = 0) => v.toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: digits });

function numbersOf(r: AnalysisResult): { label: string; value: string }[] {
  const out: { label: string; value: string }[] = [];
  const pd = r.phases?.pulldown;
  if (pd) out.push({ label: "Lowest reached before isolating", value: `${fmt(pd.lowestMicrons)} microns` });
  if (r.isolationAt != null) out.push({ label: "Isolated at", value: `${fmt(r.isolationAt / 60, 1)} min into the log` });
  const d = r.decay;
  if (d) {
    out.push({ label: "Hold", value: `${fmt(d.holdSeconds / 60, 1)} min` });
    out.push({ label: "Start → end of hold", value: `${fmt(d.startMicrons)} → ${fmt(d.endMicrons)} microns (rise ${fmt(d.riseMicrons)})` });
    out.push({ label: "Steady climb", value: `${fmt(d.leakRateMicronsPerMinute, 1)} microns/min` });
    if (d.plateauMicrons != null) out.push({ label: "Levels off near", value: `${fmt(d.plateauMicrons)} microns` });
  }
  if (r.leakRate) out.push({ label: "Leak rate", value: `${r.leakRate.mbarLitresPerSecond.toExponential(2)} mbar·L/s (volume ${fmt(r.leakRate.volumeLitres, 1)} L)` });
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

/**
 * The report of one test of the organization, or null when there is none. The caller has
 * already decided the reader may see it (a member who can see the test, or a valid share link).
 */
export async function buildReportModel(db: Db, params: { organizationId: string; testId: string }): Promise<ReportModel | null> {
  const org = params.organizationId;
  // Read as the organization (the caller checked access): the owner's view of the test.
  const row = await getTestById(db, { viewer: { organizationId: org, userId: "", role: "owner" }, testId: params.testId });
  if (!row) return null;
  const t = row.test;
  const [orgName, analysis, site, system, signOff] = await Promise.all([
    getOrganizationNameById(db, { organizationId: org }),
    t.currentAnalysisId ? getAnalysisById(db, { organizationId: org, analysisId: t.currentAnalysisId }) : null,
    t.siteId ? getSiteById(db, { organizationId: org, siteId: t.siteId }) : null,
    t.systemId ? getSystemById(db, { organizationId: org, systemId: t.systemId }) : null,
    getLatestSignOffByTest(db, { organizationId: org, testId: t.id }),
  ]);
  const r = analysis?.result ?? null;
  return {
    testId: t.id,
    organizationName: orgName ?? "",
    title: t.title,
    status: t.status,
    testedAt: t.testedAt.toISOString(),
    technicianName: row.createdByName,
    customerName: site?.customerName ?? null,
    siteName: site?.name ?? null,
    siteAddress: site?.address ?? null,
    system: system
      ? { name: system.name, kind: system.kind, refrigerant: system.refrigerant, lineSetFeet: system.lineSetFeet, liquidOd: system.liquidOd, suctionOd: system.suctionOd }
      : null,
    refrigerant: t.refrigerant ?? system?.refrigerant ?? null,
    rigNote: t.rigNote,
    notes: t.notes,
    isPractice: t.isPractice,
    verdict: r?.verdict ?? null,
    verdictWords: verdictLabel(r?.verdict ?? null),
    confidence: r?.confidence ?? null,
    numbers: r ? numbersOf(r) : [],
    profile: analysis?.profile ?? null,
    meetsProfile: r?.meetsProfile ?? null,
    profileRules: (r?.profileRules ?? []).map((x) => ({ label: RULE_LABELS[x.rule] ?? x.rule, met: x.met, detail: x.detail })),
    findings: (r?.findings ?? []).map((f) => ({ title: f.title, message: f.message, severity: f.severity, checks: f.checks })),
    signOff: signOff && t.status === "signed_off" ? { by: signOff.actorName ?? "A former member", at: signOff.at.toISOString(), note: signOff.note } : null,
    curve: analysis && r ? curveOf(analysis.series, r) : null,
    cautions: REPORT_CAUTIONS,
    engineVersion: r?.engineVersion ?? null,
  };
}

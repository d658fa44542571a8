/**
 * The report as a document: its sections in order, each a heading and plain blocks of text. The
 * HTML report (components/review/ReportView.tsx) and the PDF (pdf.ts) both draw exactly these, so
 * the two copies never say different things. Pure.
 */
import { stepsLine } from "@/lib/verdict/words";
import type { ReportModel } from "./model";

export type Block =
  | { kind: "paragraph"; text: string; tone?: "strong" | "muted"; testId?: string }
  | { kind: "rows"; rows: [string, string][]; testId?: string }
  | { kind: "numbers"; rows: { label: string; value: string; definition: string }[] }
  | { kind: "list"; items: string[]; numbered?: boolean; testId?: string }
  | { kind: "finding"; title: string; message: string; checks: string[] }
  | { kind: "curve" };

export interface Section {
  id: string;
  heading: string;
  blocks: Block[];
}

export interface ReportDocument {
  organizationName: string;
  title: string;
  subtitle: string;
  practice: string | null;
  sections: Section[];
  footer: string[];
}

const n = (v: number) => v.toLocaleString("en-US");

function curveSection(m: ReportModel): Section {
  const s = m.story;
  if (!s) return { id: "curve-says", heading: "What the curve shows", blocks: [{ kind: "paragraph", text: "Not analysed." }] };
  const blocks: Block[] = [
    { kind: "paragraph", text: s.curve.headline, tone: "strong", testId: "report-curve-headline" },
    { kind: "paragraph", text: s.curve.meaning },
  ];
  if (s.holdSentence) blocks.push({ kind: "paragraph", text: s.holdSentence, testId: "report-hold-sentence" });
  blocks.push({
    kind: "paragraph",
    text: s.confidence ? `Confidence in this reading: ${s.confidence.percent} % (${s.confidence.words}).${s.confidence.why.length ? ` ${s.confidence.why.join(" ")}` : ""}` : "Confidence: not judged; the hold is not long enough to judge.",
    tone: "muted",
    testId: "report-confidence",
  });
  if (s.forecast) blocks.push({ kind: "paragraph", text: `${s.forecast.headline}. ${s.forecast.note}`, testId: "report-forecast" });
  blocks.push({ kind: "paragraph", text: `Usual next step: ${s.curve.next}` });
  return { id: "curve-says", heading: "What the curve shows", blocks };
}

function profileSection(m: ReportModel): Section | null {
  if (!m.profile || !m.story) return null;
  const p = m.profile;
  return {
    id: "profile",
    heading: `The shop's acceptance profile: ${p.name}`,
    blocks: [
      { kind: "paragraph", text: m.story.profile.sentence, tone: "strong", testId: "report-profile-sentence" },
      {
        kind: "paragraph",
        text: `Isolate at or below ${n(p.targetMicrons)} microns, hold ${p.holdMinutes} min, stay at or below ${n(p.limitMicrons)} microns, and a steady climb under ${p.leakRateMicronsPerMinute} microns/min.`,
        tone: "muted",
      },
      { kind: "list", items: m.profileRules.map((r) => `${r.met ? "Met" : "Not met"}: ${r.label} (${r.detail})`), testId: "report-rules" },
    ],
  };
}

function jobSection(m: ReportModel): Section {
  const rows: [string, string | null][] = [
    ["Customer", m.customerName],
    ["Site", m.siteName],
    ["Address", m.siteAddress],
    ["System", m.system ? [m.system.name, m.system.kind].filter(Boolean).join(", ") : null],
    ["Refrigerant", m.refrigerant],
    ...m.conditions,
    ["Technician", m.technicianName],
    ["Tested", m.testedAtWords],
  ];
  return { id: "job", heading: "The job", blocks: [{ kind: "rows", rows: rows.filter((r): r is [string, string] => !!r[1]), testId: "report-job" }] };
}

function equipmentSection(m: ReportModel): Section | null {
  if (!m.rig && !m.rigNote) return null;
  const rows: [string, string][] = [];
  if (m.rig) {
    rows.push(["Rig", `${m.rig.name}${m.rig.truck ? ` (${m.rig.truck})` : ""}`]);
    for (const p of m.rig.pieces) rows.push([p.kind, `${p.label}: ${p.upkeep}`]);
  }
  if (m.rigNote) rows.push(["Rig note", m.rigNote]);
  return { id: "equipment", heading: "Gauge and rig used", blocks: [{ kind: "rows", rows, testId: "report-equipment" }] };
}

/** The sections of a report, in reading order. */
export function reportDocument(m: ReportModel): ReportDocument {
  const sections: (Section | null)[] = [
    curveSection(m),
    profileSection(m),
    jobSection(m),
    equipmentSection(m),
    m.curve ? { id: "curve", heading: "The curve", blocks: [{ kind: "curve" }, { kind: "paragraph", text: "Shaded: the hold after isolation. Dashed red: the profile's limit. Dashed green: isolation.", tone: "muted" }] } : null,
    m.numbers.length ? { id: "numbers", heading: "The numbers", blocks: [{ kind: "numbers", rows: m.numbers }] } : null,
    m.findings.length ? { id: "findings", heading: "Findings", blocks: m.findings.map((f) => ({ kind: "finding" as const, title: f.title, message: f.message, checks: f.checks })) } : null,
    {
      id: "review",
      heading: "Review",
      blocks: [
        { kind: "paragraph", text: m.review.headline, tone: "strong", testId: "report-signoff" },
        ...(m.review.acceptedWithReason ? [{ kind: "paragraph" as const, text: `Reason for accepting it: ${m.review.acceptedWithReason.reason}`, testId: "report-accepted-reason" }] : []),
        ...(m.review.history.length ? [{ kind: "list" as const, items: m.review.history }] : []),
      ],
    },
    m.customerNote ? { id: "customer-note", heading: "Note for you", blocks: [{ kind: "paragraph", text: m.customerNote, testId: "report-customer-note" }] } : null,
    { id: "cautions", heading: "Cautions", blocks: [{ kind: "list", items: [...m.cautions] }] },
  ];
  const footer = [
    m.raw ? `Raw log: ${m.raw.filename}, ${n(m.raw.sizeBytes)} bytes, SHA-256 ${m.raw.sha256}.` : "Raw log: none stored.",
    `Made with Riseline${m.engineVersion ? `, analysis engine ${m.engineVersion}` : ""}${m.calibration ? ` (confidence calibration: ${m.calibration})` : ""}. Test id ${m.testId}. Times in ${m.timeZone}.`,
  ];
  return {
    organizationName: m.organizationName,
    title: "Evacuation and decay test report",
    subtitle: m.title,
    practice: m.isPractice ? "Practice test (training record, not a job record)." : null,
    sections: sections.filter((s): s is Section => s !== null),
    footer,
  };
}

/** A finding's checks as one line of steps ("Keep evacuating. Warm the circuit."), for plain-text copies. */
export function checksLine(checks: string[]): string {
  return stepsLine(checks);
}

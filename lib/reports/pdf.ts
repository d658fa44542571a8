/**
 * The report as a PDF (pdfkit, built-in Helvetica). The curve is drawn with vector paths:
 * log-scale microns against minutes, the hold shaded, a dashed isolation marker and a dashed
 * limit line, like the chart on screen.
 */
import PDFDocument from "pdfkit";
import type { ReportCurve, ReportModel } from "./model";
import { logAxisOf } from "./axis";

export { logAxisOf };

const INK = "#14232b";
const MUTED = "#50616b";
const ACCENT = "#0b6e69";
const LIMIT = "#b3261e";
const HOLD_FILL = "#e3f1ef";

function drawCurve(doc: PDFKit.PDFDocument, curve: ReportCurve, x0: number, y0: number, w: number, h: number) {
  const { minLog, maxLog } = logAxisOf(curve);
  const xMax = Math.max(1, ...curve.xMinutes);
  const px = (m: number) => x0 + (Math.min(Math.max(m, 0), xMax) / xMax) * w;
  const py = (microns: number) => {
    const l = Math.log10(Math.max(microns, 10 ** minLog));
    return y0 + h - ((Math.min(l, maxLog) - minLog) / (maxLog - minLog)) * h;
  };
  doc.save();
  if (curve.hold) {
    doc.rect(px(curve.hold.startMinutes), y0, px(curve.hold.endMinutes) - px(curve.hold.startMinutes), h).fill(HOLD_FILL);
  }
  // Grid and y labels at each decade.
  doc.lineWidth(0.4).strokeColor("#c9d3d8").fillColor(MUTED).fontSize(7);
  for (let d = minLog; d <= maxLog; d++) {
    const y = py(10 ** d);
    doc.moveTo(x0, y).lineTo(x0 + w, y).stroke();
    doc.text((10 ** d).toLocaleString("en-US"), x0 - 44, y - 3, { width: 40, align: "right" });
  }
  const stepMin = xMax > 120 ? 30 : xMax > 60 ? 15 : xMax > 20 ? 5 : 2;
  for (let m = 0; m <= xMax + 1e-9; m += stepMin) {
    const x = px(m);
    doc.moveTo(x, y0 + h).lineTo(x, y0 + h + 3).stroke();
    doc.text(`${m}`, x - 15, y0 + h + 5, { width: 30, align: "center" });
  }
  doc.text("minutes from the start of the log", x0, y0 + h + 16, { width: w, align: "center" });
  doc.save().rotate(-90, { origin: [x0 - 52, y0 + h / 2] }).text("microns (log scale)", x0 - 52 - 50, y0 + h / 2 - 4, { width: 100, align: "center" }).restore();
  doc.lineWidth(0.8).strokeColor(INK).rect(x0, y0, w, h).stroke();

  // Limit line.
  doc.lineWidth(1).strokeColor(LIMIT).dash(5, { space: 3 });
  doc.moveTo(x0, py(curve.limitMicrons)).lineTo(x0 + w, py(curve.limitMicrons)).stroke();
  doc.undash().fillColor(LIMIT).fontSize(7).text(`limit ${curve.limitMicrons.toLocaleString("en-US")}`, x0 + 4, py(curve.limitMicrons) - 9, { width: 80 });
  // Isolation marker.
  if (curve.isolationMinutes != null) {
    const x = px(curve.isolationMinutes);
    doc.lineWidth(1).strokeColor(ACCENT).dash(2, { space: 2 }).moveTo(x, y0).lineTo(x, y0 + h).stroke().undash();
    doc.fillColor(ACCENT).text("isolated", x + 3, y0 + 3);
  }
  // The readings.
  if (curve.xMinutes.length > 1) {
    doc.lineWidth(1.3).strokeColor(INK).lineJoin("round");
    doc.moveTo(px(curve.xMinutes[0]), py(curve.microns[0]));
    for (let i = 1; i < curve.xMinutes.length; i++) doc.lineTo(px(curve.xMinutes[i]), py(curve.microns[i]));
    doc.stroke();
  }
  doc.restore();
}

function heading(doc: PDFKit.PDFDocument, text: string) {
  if (doc.y > doc.page.height - 120) doc.addPage();
  doc.moveDown(0.6).fillColor(ACCENT).font("Helvetica-Bold").fontSize(12).text(text).moveDown(0.2).font("Helvetica").fontSize(10).fillColor(INK);
}

function pairs(doc: PDFKit.PDFDocument, rows: [string, string | null | undefined][]) {
  const left = doc.page.margins.left;
  for (const [k, v] of rows) {
    if (v == null || v === "") continue;
    const y = doc.y;
    doc.fillColor(MUTED).text(k, left, y, { width: 150 });
    const yAfterKey = doc.y;
    doc.fillColor(INK).text(v, left + 160, y, { width: doc.page.width - left - doc.page.margins.right - 160 });
    doc.y = Math.max(doc.y, yAfterKey);
  }
  doc.x = left;
}

/** The report PDF as bytes. `compress: false` leaves content streams readable (tests count the path operators). */
export async function renderReportPdf(m: ReportModel, opts: { compress?: boolean } = {}): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER", margin: 54, compress: opts.compress ?? true, info: { Title: `Vacuum test report — ${m.title}`, Author: m.organizationName, Creator: "Riseline" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve, reject) => {
    doc.on("end", () => resolve());
    doc.on("error", reject);
  });

  doc.font("Helvetica").fillColor(MUTED).fontSize(10).text(m.organizationName);
  doc.font("Helvetica-Bold").fillColor(INK).fontSize(18).text("Evacuation and decay test report");
  doc.font("Helvetica").fontSize(12).text(m.title);
  if (m.isPractice) doc.fillColor(MUTED).fontSize(10).text("Practice test (training record, not a job record).");
  doc.moveDown(0.5);

  doc.font("Helvetica-Bold").fontSize(14).fillColor(m.verdict === "pass" ? ACCENT : LIMIT).text(`Verdict: ${m.verdictWords}`);
  doc.font("Helvetica").fontSize(10).fillColor(INK);
  if (m.meetsProfile != null && m.profile) doc.text(`${m.meetsProfile ? "Meets" : "Does not meet"} the acceptance profile "${m.profile.name}".`);
  if (m.confidence != null) doc.fillColor(MUTED).text(`Confidence ${Math.round(m.confidence * 100)} %.`).fillColor(INK);

  heading(doc, "The job");
  pairs(doc, [
    ["Customer", m.customerName],
    ["Site", m.siteName],
    ["Address", m.siteAddress],
    ["System", m.system ? [m.system.name, m.system.kind].filter(Boolean).join(", ") : null],
    ["Refrigerant", m.refrigerant],
    ["Line set", m.system?.lineSetFeet ? `${m.system.lineSetFeet} ft, ${m.system.liquidOd ?? "?"} in. liquid / ${m.system.suctionOd ?? "?"} in. suction` : null],
    ["Technician", m.technicianName],
    ["Tested", new Date(m.testedAt).toUTCString()],
    ["Rig", m.rigNote],
    ["Notes", m.notes],
  ]);

  if (m.curve) {
    heading(doc, "The curve");
    const x0 = doc.page.margins.left + 56;
    const w = doc.page.width - doc.page.margins.right - x0;
    const h = 210;
    if (doc.y + h + 40 > doc.page.height - doc.page.margins.bottom) doc.addPage();
    const y0 = doc.y + 4;
    drawCurve(doc, m.curve, x0, y0, w, h);
    doc.x = doc.page.margins.left;
    doc.y = y0 + h + 30;
    doc.fontSize(8).fillColor(MUTED).text("Shaded: the hold after isolation. Dashed red: the profile's limit. Dashed green: isolation.").fontSize(10).fillColor(INK);
  }

  heading(doc, "The numbers");
  pairs(doc, m.numbers.map((n) => [n.label, n.value]));

  if (m.profile) {
    heading(doc, `Acceptance profile: ${m.profile.name}`);
    doc.text(`Isolate at or below ${m.profile.targetMicrons} microns, hold ${m.profile.holdMinutes} min, stay at or below ${m.profile.limitMicrons} microns, steady climb under ${m.profile.leakRateMicronsPerMinute} microns/min.`);
    for (const r of m.profileRules) doc.text(`${r.met ? "Met" : "NOT met"}: ${r.label} (${r.detail})`);
  }

  if (m.findings.length) {
    heading(doc, "Findings");
    for (const f of m.findings) {
      doc.font("Helvetica-Bold").text(f.title).font("Helvetica").text(f.message);
      if (f.checks.length) doc.fillColor(MUTED).text(`Check: ${f.checks.join("; ")}`).fillColor(INK);
      doc.moveDown(0.3);
    }
  }

  heading(doc, "Sign-off");
  doc.text(m.signOff ? `Signed off by ${m.signOff.by} on ${new Date(m.signOff.at).toUTCString()}.${m.signOff.note ? ` ${m.signOff.note}` : ""}` : "Not signed off.");

  heading(doc, "Cautions");
  doc.fontSize(9);
  for (const c of m.cautions) doc.text(`• ${c}`).moveDown(0.2);
  doc.fillColor(MUTED).fontSize(8).moveDown(0.5).text(`Made with Riseline${m.engineVersion ? ` (analysis ${m.engineVersion})` : ""}. Test id ${m.testId}.`);

  doc.end();
  await done;
  return Buffer.concat(chunks);
}

/**
 * The report as a PDF (pdfkit), drawn from the same sections as the HTML report
 * (lib/reports/document.ts), in the app's own font: IBM Plex Sans from @fontsource/ibm-plex-sans,
 * embedded from its WOFF files (fontkit reads WOFF), so every character prints (glyphs.ts writes the
 * few the font lacks in words). The curve is drawn with vector paths: log-scale microns against
 * minutes, the hold shaded, a dashed isolation marker and a dashed limit line, like the chart on screen.
 */
import path from "node:path";
import PDFDocument from "pdfkit";
import type { ReportCurve, ReportModel } from "./model";
import { logAxisOf } from "./axis";
import { reportDocument, type Block } from "./document";
import { pdfText } from "./glyphs";

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
    doc.text(pdfText((10 ** d).toLocaleString("en-US")), x0 - 44, y - 3, { width: 40, align: "right" });
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

/** The font files, shipped with the app (a dependency, read from node_modules at run time). */
const FONT_DIR = path.join(process.cwd(), "node_modules", "@fontsource", "ibm-plex-sans", "files");
export const PDF_FONTS = {
  regular: path.join(FONT_DIR, "ibm-plex-sans-latin-400-normal.woff"),
  semibold: path.join(FONT_DIR, "ibm-plex-sans-latin-600-normal.woff"),
} as const;
const REGULAR = "Plex";
const CURVE_HEIGHT = 210;
const SEMIBOLD = "Plex-Semibold";

/** A section heading, on a new page when less than `keepWith` points would follow it on this one. */
function heading(doc: PDFKit.PDFDocument, text: string, keepWith = 60) {
  if (doc.y > doc.page.height - doc.page.margins.bottom - keepWith - 20) doc.addPage();
  doc.moveDown(0.6).fillColor(ACCENT).font(SEMIBOLD).fontSize(12).text(pdfText(text)).moveDown(0.2).font(REGULAR).fontSize(10).fillColor(INK);
}

function pairs(doc: PDFKit.PDFDocument, rows: [string, string][], keyWidth = 150) {
  const left = doc.page.margins.left;
  for (const [k, v] of rows) {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 30) doc.addPage();
    const y = doc.y;
    doc.fillColor(MUTED).text(pdfText(k), left, y, { width: keyWidth });
    const yAfterKey = doc.y;
    doc.fillColor(INK).text(pdfText(v), left + keyWidth + 10, y, { width: doc.page.width - left - doc.page.margins.right - keyWidth - 10 });
    doc.y = Math.max(doc.y, yAfterKey);
  }
  doc.x = left;
}

function drawBlock(doc: PDFKit.PDFDocument, b: Block, m: ReportModel) {
  const left = doc.page.margins.left;
  switch (b.kind) {
    case "paragraph":
      doc.font(b.tone === "strong" ? SEMIBOLD : REGULAR).fillColor(b.tone === "muted" ? MUTED : INK).text(pdfText(b.text)).font(REGULAR).fillColor(INK).moveDown(0.2);
      return;
    case "rows":
      pairs(doc, b.rows);
      return;
    case "numbers":
      for (const r of b.rows) {
        pairs(doc, [[r.label, r.value]]);
        doc.fontSize(8).fillColor(MUTED).text(pdfText(r.definition), left + 160, doc.y, { width: doc.page.width - left - doc.page.margins.right - 160 }).fontSize(10).fillColor(INK);
        doc.x = left;
      }
      return;
    case "list":
      b.items.forEach((item, i) => doc.text(pdfText(`${b.numbered ? `${i + 1}.` : "•"} ${item}`), { indent: 0 }).moveDown(0.15));
      return;
    case "finding":
      doc.font(SEMIBOLD).text(pdfText(b.title)).font(REGULAR).text(pdfText(b.message));
      if (b.checks.length) {
        doc.fillColor(MUTED).text("Check, in this order:");
        b.checks.forEach((c, i) => doc.text(pdfText(`${i + 1}. ${c}`), left + 12));
        doc.x = left;
        doc.fillColor(INK);
      }
      doc.moveDown(0.3);
      return;
    case "curve": {
      if (!m.curve) return;
      const x0 = left + 56;
      const w = doc.page.width - doc.page.margins.right - x0;
      const h = CURVE_HEIGHT;
      if (doc.y + h + 40 > doc.page.height - doc.page.margins.bottom) doc.addPage();
      const y0 = doc.y + 4;
      drawCurve(doc, m.curve, x0, y0, w, h);
      doc.x = left;
      doc.y = y0 + h + 30;
      return;
    }
  }
}

/** The report PDF as bytes. `compress: false` leaves content streams readable (tests count the path operators). */
export async function renderReportPdf(m: ReportModel, opts: { compress?: boolean } = {}): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER", margin: 54, compress: opts.compress ?? true, info: { Title: pdfText(`Vacuum test report - ${m.title}`), Author: pdfText(m.organizationName), Creator: "Riseline" } });
  doc.registerFont(REGULAR, PDF_FONTS.regular);
  doc.registerFont(SEMIBOLD, PDF_FONTS.semibold);
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve, reject) => {
    doc.on("end", () => resolve());
    doc.on("error", reject);
  });
  const d = reportDocument(m);

  doc.font(REGULAR).fillColor(MUTED).fontSize(10).text(pdfText(d.organizationName));
  doc.font(SEMIBOLD).fillColor(INK).fontSize(18).text(pdfText(d.title));
  doc.font(REGULAR).fontSize(12).text(pdfText(d.subtitle));
  if (d.practice) doc.fillColor(MUTED).fontSize(10).text(pdfText(d.practice));
  doc.fontSize(10).fillColor(INK);
  for (const s of d.sections) {
    // The curve keeps its heading with it (the chart is 210 pt tall plus its axis labels).
    heading(doc, s.heading, s.blocks[0]?.kind === "curve" ? CURVE_HEIGHT + 50 : 60);
    for (const b of s.blocks) drawBlock(doc, b, m);
  }
  doc.moveDown(0.8).fillColor(MUTED).fontSize(8);
  for (const line of d.footer) doc.text(pdfText(line));

  doc.end();
  await done;
  return Buffer.concat(chunks);
}

/**
 * The optional context a technician may add to a test (job, site, system, line set, …) and
 * how it travels: as multipart fields with a file, or as JSON beside typed readings.
 */
import { toStored } from "@/lib/units/format";

export const TUBE_SIZES = ["1/4", "3/8", "1/2", "5/8", "3/4", "7/8", "1-1/8"] as const;

export const REFRIGERANTS = ["R-410A", "R-32", "R-454B", "R-452B", "R-22", "R-134a", "R-404A", "R-407C", "R-448A", "R-290", "R-744"] as const;

/** Why a technician went out, as chips for a new visit (our own short list; free text is not needed). */
export const VISIT_REASONS = ["Install", "Leak repair", "Compressor change", "Coil change", "Service"] as const;

export interface TestContext {
  title: string;
  jobId: string;
  /** Make a new visit (job) with this test: today, the signed-in technician, the site and system below. */
  newJob: boolean;
  newJobReason: string;
  /** Typed or picked site name; siteId is set when it matches an existing site. */
  siteName: string;
  siteId: string;
  systemName: string;
  systemId: string;
  refrigerant: string;
  /** The line-set length as typed, in `lengthUnit` (feet unless the reader works in metres). */
  lineSetFeet: string;
  lengthUnit?: "ft" | "m";
  liquidOd: string;
  suctionOd: string;
  volumeLitres: string;
  ambient: string;
  ambientUnit: "C" | "F";
  notes: string;
  /** Printed on the customer's copy of the report; `notes` stay internal. */
  customerNote: string;
  rigNote: string;
  isPractice: boolean;
}

export const EMPTY_CONTEXT: TestContext = {
  title: "",
  jobId: "",
  newJob: false,
  newJobReason: "",
  siteName: "",
  siteId: "",
  systemName: "",
  systemId: "",
  refrigerant: "",
  lineSetFeet: "",
  liquidOd: "",
  suctionOd: "",
  volumeLitres: "",
  ambient: "",
  ambientUnit: "F",
  notes: "",
  customerNote: "",
  rigNote: "",
  isPractice: false,
};

/** Today on the technician's own calendar (YYYY-MM-DD), not the server's UTC day. */
export function localDate(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

function num(s: string): number | undefined {
  const v = Number(s.trim().replace(",", "."));
  return s.trim() !== "" && Number.isFinite(v) ? v : undefined;
}

/** °F → °C: (F − 32) · 5/9. */
export function ambientCelsius(ctx: TestContext): number | undefined {
  const v = num(ctx.ambient);
  if (v === undefined) return undefined;
  return ctx.ambientUnit === "F" ? Math.round(((v - 32) * 5) / 9 * 10) / 10 : v;
}

/** The context as API fields; empty fields are left out so nothing is ever required. */
export function contextFields(ctx: TestContext): Record<string, string | number | boolean> {
  const out: Record<string, string | number | boolean> = {};
  const text = (k: string, v: string) => {
    if (v.trim()) out[k] = v.trim();
  };
  text("title", ctx.title);
  if (ctx.newJob && !ctx.isPractice) {
    out.newJob = true;
    out.newJobVisitedOn = localDate();
    text("newJobReason", ctx.newJobReason);
  } else text("jobId", ctx.jobId);
  if (ctx.siteId) out.siteId = ctx.siteId;
  else text("newSiteName", ctx.siteName);
  if (ctx.systemId) out.systemId = ctx.systemId;
  else if (ctx.siteId || ctx.siteName.trim()) text("newSystemName", ctx.systemName);
  text("refrigerant", ctx.refrigerant);
  const typed = num(ctx.lineSetFeet);
  // Stored in feet as before; metres ÷ 0.3048 (NIST SP 811: 1 ft = 0.3048 m exactly).
  if (typed !== undefined) out.lineSetFeet = ctx.lengthUnit === "m" ? toStored.length(typed, "metric") : typed;
  text("liquidOd", ctx.liquidOd);
  text("suctionOd", ctx.suctionOd);
  const litres = num(ctx.volumeLitres);
  if (litres !== undefined) out.volumeLitres = litres;
  const c = ambientCelsius(ctx);
  if (c !== undefined) out.ambientC = c;
  text("notes", ctx.notes);
  text("customerNote", ctx.customerNote);
  text("rigNote", ctx.rigNote);
  if (ctx.isPractice) out.isPractice = true;
  return out;
}

export function appendContext(form: FormData, ctx: TestContext): void {
  for (const [k, v] of Object.entries(contextFields(ctx))) form.set(k, String(v));
}

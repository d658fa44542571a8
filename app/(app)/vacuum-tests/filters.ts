/** The tests list filters as they live in the address bar, and as the API wants them. */
import type { TestFilters } from "@/lib/client/api";

export interface ListFilters {
  verdict: string;
  technicianId: string;
  siteId: string;
  /** YYYY-MM-DD (local day). */
  from: string;
  to: string;
  isPractice: "" | "true" | "false";
}

export const NO_FILTERS: ListFilters = { verdict: "", technicianId: "", siteId: "", from: "", to: "", isPractice: "" };

export function filtersFromParams(p: URLSearchParams): ListFilters {
  const practice = p.get("isPractice");
  return {
    verdict: p.get("verdict") ?? "",
    technicianId: p.get("technicianId") ?? "",
    siteId: p.get("siteId") ?? "",
    from: p.get("from") ?? "",
    to: p.get("to") ?? "",
    isPractice: practice === "true" || practice === "false" ? practice : "",
  };
}

export function filtersToParams(f: ListFilters): URLSearchParams {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v) p.set(k, v);
  return p;
}

/** Local calendar days → instants: from the start of `from` to the end of `to`. */
export function filtersForApi(f: ListFilters): TestFilters {
  const day = (d: string, end: boolean) => {
    if (!/^\d{4}-\d{2}-\d{2}$/.test(d)) return undefined;
    const t = new Date(`${d}T${end ? "23:59:59.999" : "00:00:00"}`);
    return Number.isNaN(t.getTime()) ? undefined : t.toISOString();
  };
  return {
    verdict: f.verdict || undefined,
    technicianId: f.technicianId || undefined,
    siteId: f.siteId || undefined,
    from: day(f.from, false),
    to: day(f.to, true),
    isPractice: f.isPractice || undefined,
  };
}

export function activeCount(f: ListFilters): number {
  return Object.values(f).filter(Boolean).length;
}

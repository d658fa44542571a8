/** The casebook's test picker: one searchable line per test. Pure. */
import { outcomeOf } from "@/lib/verdict/words";

export interface RecentTest {
  id: string;
  title: string;
  verdict: string | null;
  meetsProfile?: boolean | null;
  siteName?: string | null;
  technicianName?: string | null;
  testedAt: string;
}

/** One line per test that tells identical titles apart: site, technician, date and the verdict in words. */
export function pickerLabel(t: RecentTest): string {
  const when = new Date(t.testedAt).toLocaleDateString("en-US", { dateStyle: "medium" });
  const verdict = t.verdict ? outcomeOf(t.verdict, t.meetsProfile ?? null).label : "not analysed";
  return [t.title, t.siteName, t.technicianName, when, verdict].filter(Boolean).join(" · ");
}


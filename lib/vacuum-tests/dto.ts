/** What the tests API returns: the shapes the pages are built against. */
import type { VacuumTestDetailRow } from "@/db/queries/vacuum-tests";
import type { TestStatus } from "@/db/schema";

export interface VacuumTestDto {
  id: string;
  title: string;
  source: "file" | "typed";
  status: TestStatus;
  verdict: string | null;
  isPractice: boolean;
  helpRequested: boolean;
  testedAt: string;
  createdAt: string;
  technician: { id: string; name: string };
  job: { id: string; reference: string | null; visitedOn: string | null; reason: string | null } | null;
  site: { id: string; name: string } | null;
  system: { id: string; name: string } | null;
  refrigerant: string | null;
  lineSetFeet: number | null;
  liquidOd: string | null;
  suctionOd: string | null;
  volumeLitres: number | null;
  ambientC: number | null;
  notes: string | null;
  /** For the customer's copy of the report; `notes` stay internal. */
  customerNote: string | null;
  rigNote: string | null;
  currentAnalysisId: string | null;
}

export interface VacuumTestListItem {
  id: string;
  title: string;
  verdict: string | null;
  confidence: number | null;
  status: TestStatus;
  testedAt: string;
  technician: { id: string; name: string };
  site: { id: string; name: string } | null;
  systemName: string | null;
  isPractice: boolean;
  startMicrons: number | null;
  endMicrons: number | null;
  leakRateMicronsPerMinute: number | null;
  /** Whether the current analysis met the shop's profile (null when not analysed or hidden). */
  meetsProfile: boolean | null;
  findingCodes: string[];
}

export interface AnalysisHistoryEntry {
  id: string;
  version: number;
  verdict: string;
  confidence: number;
  meetsProfile: boolean | null;
  createdAt: string;
  createdBy: { id: string; name: string };
  reason: string | null;
  options: unknown;
}

export function toVacuumTestDto(row: VacuumTestDetailRow): VacuumTestDto {
  const t = row.test;
  return {
    id: t.id,
    title: t.title,
    source: t.source,
    status: t.status,
    verdict: t.verdict,
    isPractice: t.isPractice,
    helpRequested: t.helpRequested,
    testedAt: t.testedAt.toISOString(),
    createdAt: t.createdAt.toISOString(),
    technician: { id: t.createdById, name: row.createdByName },
    job: t.jobId ? { id: t.jobId, reference: row.jobReference, visitedOn: row.jobVisitedOn, reason: row.jobReason } : null,
    site: t.siteId && row.siteName !== null ? { id: t.siteId, name: row.siteName } : null,
    system: t.systemId && row.systemName !== null ? { id: t.systemId, name: row.systemName } : null,
    refrigerant: t.refrigerant,
    lineSetFeet: t.lineSetFeet,
    liquidOd: t.liquidOd,
    suctionOd: t.suctionOd,
    volumeLitres: t.volumeLitres,
    ambientC: t.ambientC,
    notes: t.notes,
    customerNote: t.customerNote,
    rigNote: t.rigNote,
    currentAnalysisId: t.currentAnalysisId,
  };
}

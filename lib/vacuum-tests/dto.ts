/** Building what the tests API returns; the shapes themselves are declared in lib/contracts/vacuum-tests.ts. */
import type { VacuumTestDetailRow } from "@/db/queries/vacuum-tests";
import type { AnalysisHistoryEntry, VacuumTestDto, VacuumTestListItem } from "@/lib/contracts/vacuum-tests";

export type { AnalysisHistoryEntry, VacuumTestDto, VacuumTestListItem };

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

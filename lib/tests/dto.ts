/** Building what the tests API returns; the shapes themselves are declared in contracts/vacuum-tests.ts. */
import type { TestDetailRow } from "@/db/queries/tests";
import type { AnalysisHistoryEntry, TestDto, TestListItem } from "@/contracts/vacuum-tests";

export type { AnalysisHistoryEntry, TestDto, TestListItem };

export function toTestDto(row: TestDetailRow): TestDto {
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

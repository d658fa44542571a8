/** Reading tests back: one test with its analysis, chart series and history; the list page. */
import type { AnalysisResult } from "@/analysis/decay/types";
import type { Db } from "@/db/client";
import { getAnalysisById, getAnalysisByTestAndId, listAnalysesByTest } from "@/db/queries/analyses";
import { getTestById, getUploadByTest, listTestsByOrganization, type VacuumTestDetailRow } from "@/db/queries/vacuum-tests";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { hiddenPracticeTestIds, practiceGate, practisesCalls } from "@/lib/practice/gate";
import { toVacuumTestDto, type AnalysisHistoryEntry, type VacuumTestListItem } from "./dto";
import type { ListVacuumTestsQuery } from "./schemas";
import type { ShownAnalysis, VacuumTestDetail, VacuumTestSummary } from "@/lib/contracts/vacuum-tests";

export type { ShownAnalysis, VacuumTestDetail, VacuumTestSummary };

/** A visible test or a 404 (unknown, other organization and not visible all look the same). */
export async function requireVisibleTest(db: Db, viewer: Viewer, testId: string) {
  const row = await getTestById(db, { viewer, testId });
  if (!row) throw new AppError("not_found", "No such test.");
  return row;
}

/**
 * A visible test whose analysis the viewer may see. An apprentice's practice test stays closed
 * until they have made their own call (403 naming where to make it), so no verdict leaks first.
 */
export async function requireRevealedTest(db: Db, viewer: Viewer, testId: string) {
  const row = await requireVisibleTest(db, viewer, testId);
  const gate = await practiceGate(db, { organizationId: viewer.organizationId, testId, userId: viewer.userId, role: viewer.role });
  if (gate === "hidden") {
    throw new AppError("forbidden", "Make your practice call first; the analysis shows once you have.", { practiceCallUrl: `/practice/${testId}` });
  }
  return row;
}

/**
 * The test and its current analysis only (what POST /api/vacuum-tests answers with). `known` is what a
 * new upload just computed and wrote, so it need not read its own test back — unless the viewer
 * makes practice calls, whose gate decides whether the analysis shows: an apprentice's own
 * practice upload is saved, and answered with where to make the call instead of the verdict.
 */
export async function loadTestSummary(
  db: Db,
  viewer: Viewer,
  testId: string,
  known?: { result?: AnalysisResult; row?: VacuumTestDetailRow },
): Promise<VacuumTestSummary> {
  if (known?.result && known.row && known.row.test.createdById === viewer.userId && !practisesCalls(viewer.role)) {
    return { test: toVacuumTestDto(known.row), analysis: known.result };
  }
  const row = await requireVisibleTest(db, viewer, testId);
  const gate = await practiceGate(db, { organizationId: viewer.organizationId, testId, userId: viewer.userId, role: viewer.role });
  if (gate === "hidden") return { test: { ...toVacuumTestDto(row), verdict: null }, analysis: null, practiceCallUrl: `/practice/${testId}` };
  if (known?.result) return { test: toVacuumTestDto(row), analysis: known.result };
  const current = row.test.currentAnalysisId ? await getAnalysisById(db, { organizationId: viewer.organizationId, analysisId: row.test.currentAnalysisId }) : null;
  if (!current) throw new AppError("internal", "This test has no analysis yet.");
  return { test: toVacuumTestDto(row), analysis: current.result };
}

export async function loadTestDetail(db: Db, viewer: Viewer, testId: string): Promise<VacuumTestDetail> {
  const { detail } = await readDetail(db, viewer, testId, (org, row) =>
    row.test.currentAnalysisId ? getAnalysisById(db, { organizationId: org, analysisId: row.test.currentAnalysisId }) : Promise.resolve(null),
  );
  if (!detail) throw new AppError("internal", "This test has no analysis yet.");
  return detail;
}

type AnalysisRow = NonNullable<Awaited<ReturnType<typeof getAnalysisById>>>;

/** The visible, revealed test with the analysis `pick` chooses, the history and the newest upload. */
async function readDetail(db: Db, viewer: Viewer, testId: string, pick: (organizationId: string, row: Awaited<ReturnType<typeof requireRevealedTest>>) => Promise<AnalysisRow | null>) {
  const row = await requireRevealedTest(db, viewer, testId);
  const org = viewer.organizationId;
  const [picked, history, upload] = await Promise.all([
    pick(org, row),
    listAnalysesByTest(db, { organizationId: org, testId }),
    getUploadByTest(db, { organizationId: org, testId }),
  ]);
  const detail: VacuumTestDetail | null = picked && {
    test: toVacuumTestDto(row),
    analysis: picked.result,
    series: picked.series,
    history: history.map(toHistoryEntry),
    upload: upload ? { filename: upload.filename, sizeBytes: upload.sizeBytes, sha256: upload.sha256 } : null,
  };
  return { row, picked, history, detail };
}

function toHistoryEntry(h: Awaited<ReturnType<typeof listAnalysesByTest>>[number]): AnalysisHistoryEntry {
  return {
    id: h.id,
    version: h.version,
    verdict: h.verdict,
    confidence: h.confidence,
    meetsProfile: h.meetsProfile,
    createdAt: h.createdAt.toISOString(),
    createdBy: { id: h.createdById, name: h.createdByName },
    reason: h.reason,
    options: h.options,
  };
}

/**
 * The test detail as it was at one analysis version (GET /api/vacuum-tests/:id?analysisId=): that
 * version's analysis and series, the full history, and `shown`. The practice gate applies as for
 * the current analysis; an analysis of another test or organization answers 404.
 */
export async function loadTestDetailAtAnalysis(db: Db, viewer: Viewer, testId: string, analysisId: string): Promise<VacuumTestDetail & { shown: ShownAnalysis }> {
  const { row, picked, history, detail } = await readDetail(db, viewer, testId, (org) => getAnalysisByTestAndId(db, { organizationId: org, testId, analysisId }));
  if (!picked || !detail) throw new AppError("not_found", "This test has no analysis with that id.");
  return {
    ...detail,
    shown: { analysisId: picked.id, version: picked.version, versionCount: history.length, isCurrent: picked.id === row.test.currentAnalysisId },
  };
}

/** The opaque list cursor: base64url of the last row's testedAt (PostgreSQL text) and id. */
export function encodeCursor(testedAtKey: string, id: string): string {
  return Buffer.from(JSON.stringify([testedAtKey, id])).toString("base64url");
}

export function decodeCursor(cursor: string): { testedAt: string; id: string } {
  try {
    const [testedAt, id] = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8")) as [unknown, unknown];
    if (typeof testedAt === "string" && /^\d{4}-\d\d-\d\d[ T]\d\d:\d\d:\d\d(\.\d{1,6})?([+-]\d\d(:?\d\d)?|Z)?$/.test(testedAt) && typeof id === "string" && /^[0-9a-f-]{36}$/i.test(id))
      return { testedAt, id };
  } catch {
    // fall through
  }
  throw new AppError("invalid_input", "cursor: not a cursor this list gave out", { field: "cursor" });
}

export async function listTests(db: Db, viewer: Viewer, q: ListVacuumTestsQuery): Promise<{ items: VacuumTestListItem[]; nextCursor: string | null }> {
  const rows = await listTestsByOrganization(db, {
    viewer,
    filters: {
      verdict: q.verdict,
      technicianId: q.technicianId,
      siteId: q.siteId,
      from: q.from ? new Date(q.from) : undefined,
      to: q.to ? new Date(q.to) : undefined,
      isPractice: q.isPractice,
      after: q.cursor ? decodeCursor(q.cursor) : undefined,
      limit: q.limit,
    },
  });
  const page = rows.slice(0, q.limit);
  const last = page[page.length - 1];
  const hidden = await hiddenPracticeTestIds(db, { organizationId: viewer.organizationId, userId: viewer.userId, role: viewer.role, testIds: page.filter((r) => r.isPractice).map((r) => r.id) });
  return {
    items: page.map((r) => hidden.has(r.id) ? withoutAnalysis(toListItem(r)) : toListItem(r)),
    nextCursor: rows.length > q.limit && last ? encodeCursor(last.testedAtKey, last.id) : null,
  };
}

/** A practice test in an apprentice's list before their call: the row, but nothing of the analysis. */
function withoutAnalysis(item: VacuumTestListItem): VacuumTestListItem {
  return { ...item, verdict: null, confidence: null, startMicrons: null, endMicrons: null, leakRateMicronsPerMinute: null, meetsProfile: null, findingCodes: [] };
}

function toListItem(r: Awaited<ReturnType<typeof listTestsByOrganization>>[number]): VacuumTestListItem {
  return {
    id: r.id,
    title: r.title,
    verdict: r.verdict,
    confidence: r.confidence,
    status: r.status,
    testedAt: r.testedAt.toISOString(),
    technician: { id: r.technicianId, name: r.technicianName },
    site: r.siteId && r.siteName !== null ? { id: r.siteId, name: r.siteName } : null,
    systemName: r.systemName,
    isPractice: r.isPractice,
    startMicrons: r.startMicrons,
    endMicrons: r.endMicrons,
    leakRateMicronsPerMinute: r.leakRateMicronsPerMinute,
    meetsProfile: r.meetsProfile,
    findingCodes: r.findingCodes,
  };
}

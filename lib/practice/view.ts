/**
 * The practice API's shapes and steps: the practice view of one test (curve only until the
 * apprentice has called it), recording a call, the calls list with match rates, comments.
 */
import type { AnalysisResult } from "@/analysis/decay/types";
import type { Db } from "@/db/client";
import { getAnalysisById } from "@/db/queries/analyses";
import {
  getPracticeCallById, getPracticeCallByTestAndApprentice, insertPracticeCall, insertPracticeComment,
  listPracticeCallsByOrganization, listPracticeCommentsByCalls, listPracticeTestsByViewer,
} from "@/db/queries/practice";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { canReadAllTests } from "@/lib/permissions";
import { requireVisibleTest } from "@/lib/vacuum-tests/read";
import { practiceGate, practisesCalls } from "./gate";
import type { PracticeCallInput } from "./schemas";

export interface PracticeCallDto {
  id: string;
  testId: string;
  call: string;
  reason: string;
  analysisVerdict: string;
  matched: boolean;
  createdAt: string;
}

export interface PracticeCommentDto {
  id: string;
  body: string;
  author: { id: string; name: string };
  createdAt: string;
}

/**
 * One practice test as the practice page sees it. While `state` is "awaiting_call" there is no
 * analysis at all in the payload: only the readings.
 */
export interface PracticeTestView {
  test: { id: string; title: string; testedAt: string; technician: { id: string; name: string } };
  series: { t: number[]; p: number[] };
  state: "awaiting_call" | "revealed";
  /** The viewer's own call (apprentices), or null. */
  call: PracticeCallDto | null;
  analysis: AnalysisResult | null;
}

type CallRow = NonNullable<Awaited<ReturnType<typeof getPracticeCallById>>>;

function callDto(c: CallRow): PracticeCallDto {
  return { id: c.id, testId: c.testId, call: c.call, reason: c.reason, analysisVerdict: c.analysisVerdict, matched: c.matched, createdAt: c.createdAt.toISOString() };
}

async function practiceTestOf(db: Db, viewer: Viewer, testId: string) {
  const row = await requireVisibleTest(db, viewer, testId);
  if (!row.test.isPractice) throw new AppError("not_found", "No such practice test.");
  const analysis = row.test.currentAnalysisId
    ? await getAnalysisById(db, { organizationId: viewer.organizationId, analysisId: row.test.currentAnalysisId })
    : null;
  if (!analysis) throw new AppError("internal", "This test has no analysis yet.");
  return { row, analysis };
}

export async function loadPracticeTest(db: Db, viewer: Viewer, testId: string): Promise<PracticeTestView> {
  const { row, analysis } = await practiceTestOf(db, viewer, testId);
  const gate = await practiceGate(db, { organizationId: viewer.organizationId, testId, userId: viewer.userId, role: viewer.role });
  const own = practisesCalls(viewer.role)
    ? await getPracticeCallByTestAndApprentice(db, { organizationId: viewer.organizationId, testId, apprenticeId: viewer.userId })
    : null;
  const t = row.test;
  return {
    test: { id: t.id, title: t.title, testedAt: t.testedAt.toISOString(), technician: { id: t.createdById, name: row.createdByName } },
    series: analysis.series,
    state: gate === "hidden" ? "awaiting_call" : "revealed",
    call: own ? callDto(own) : null,
    analysis: gate === "hidden" ? null : analysis.result,
  };
}

/** An apprentice's call on a practice test they can see; the first call stands (409 after). */
export async function recordPracticeCall(db: Db, viewer: Viewer, testId: string, input: PracticeCallInput): Promise<PracticeTestView> {
  if (!practisesCalls(viewer.role)) throw new AppError("forbidden", "Practice calls are made by apprentices.");
  const { analysis } = await practiceTestOf(db, viewer, testId);
  const inserted = await insertPracticeCall(db, {
    organizationId: viewer.organizationId,
    testId,
    apprenticeId: viewer.userId,
    call: input.call,
    reason: input.reason,
    analysisVerdict: analysis.verdict,
    matched: input.call === analysis.verdict,
  });
  if (!inserted) throw new AppError("conflict", "You have already made your call on this test.");
  return loadPracticeTest(db, viewer, testId);
}

export interface PracticeTestListItem {
  id: string;
  title: string;
  testedAt: string;
  technician: { id: string; name: string };
  called: boolean;
  /** Only once called (never the verdict). */
  matched: boolean | null;
}

export async function listPracticeTests(db: Db, viewer: Viewer): Promise<PracticeTestListItem[]> {
  const rows = await listPracticeTestsByViewer(db, { viewer, limit: 100 });
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    testedAt: r.testedAt.toISOString(),
    technician: { id: r.technicianId, name: r.technicianName },
    called: r.callId !== null,
    matched: r.callId !== null ? r.matched : null,
  }));
}

export interface ApprenticeScore {
  apprentice: { id: string; name: string };
  calls: number;
  matched: number;
  /** matched / calls, 0–1. */
  matchRate: number;
}

export interface PracticeCallsOverview {
  apprentices: ApprenticeScore[];
  calls: (PracticeCallDto & { apprentice: { id: string; name: string }; testTitle: string; comments: PracticeCommentDto[] })[];
}

/** Leads, owners and trainers see every apprentice's calls; others only their own. */
export async function listPracticeCalls(db: Db, viewer: Viewer, q: { apprenticeId?: string }): Promise<PracticeCallsOverview> {
  const apprenticeId = canReadAllTests(viewer.role) ? q.apprenticeId : viewer.userId;
  const rows = await listPracticeCallsByOrganization(db, { organizationId: viewer.organizationId, apprenticeId, limit: 500 });
  const comments = await listPracticeCommentsByCalls(db, { organizationId: viewer.organizationId, callIds: rows.map((r) => r.call.id) });
  const byCall = new Map<string, PracticeCommentDto[]>();
  for (const c of comments) {
    const list = byCall.get(c.comment.callId) ?? [];
    list.push({ id: c.comment.id, body: c.comment.body, author: { id: c.comment.authorId, name: c.authorName }, createdAt: c.comment.createdAt.toISOString() });
    byCall.set(c.comment.callId, list);
  }
  const scores = new Map<string, ApprenticeScore>();
  for (const r of rows) {
    const s = scores.get(r.call.apprenticeId) ?? { apprentice: { id: r.call.apprenticeId, name: r.apprenticeName }, calls: 0, matched: 0, matchRate: 0 };
    s.calls++;
    if (r.call.matched) s.matched++;
    s.matchRate = s.matched / s.calls;
    scores.set(r.call.apprenticeId, s);
  }
  return {
    apprentices: [...scores.values()].sort((a, b) => a.apprentice.name.localeCompare(b.apprentice.name)),
    calls: rows.map((r) => ({
      ...callDto(r.call),
      apprentice: { id: r.call.apprenticeId, name: r.apprenticeName },
      testTitle: r.testTitle,
      comments: byCall.get(r.call.id) ?? [],
    })),
  };
}

/** A comment on a call: by those who see every call (trainers, leads, owners) or by the apprentice. */
export async function addPracticeComment(db: Db, viewer: Viewer & { name: string }, callId: string, body: string): Promise<PracticeCommentDto> {
  const call = await getPracticeCallById(db, { organizationId: viewer.organizationId, callId });
  if (!call || (!canReadAllTests(viewer.role) && call.apprenticeId !== viewer.userId)) throw new AppError("not_found", "No such practice call.");
  const row = await insertPracticeComment(db, { organizationId: viewer.organizationId, callId, authorId: viewer.userId, body });
  return { id: row.id, body: row.body, author: { id: viewer.userId, name: viewer.name }, createdAt: row.createdAt.toISOString() };
}

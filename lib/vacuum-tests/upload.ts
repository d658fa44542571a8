/**
 * The upload pipeline: analyse in memory → store the raw file → one DB transaction.
 *
 *  - An unreadable log throws LogError before anything is stored (422, nothing saved).
 *  - Storing and committing go through storeThenCommit (lib/vacuum-tests/stored-commit.ts), shared with
 *    the re-test upload.
 *  - Storage failing → 503, no rows written.
 *  - The transaction failing → the stored object is deleted again (compensation), 503.
 *  - An Idempotency-Key the same person already used for the same request returns the first
 *    test (or the queued task); used for a different request (another file or fields) it is a 422
 *    and nothing is saved (lib/vacuum-tests/idempotency.ts). Two identical concurrent requests race on the
 *    idempotency_keys primary key inside the transaction, the loser rolls back, deletes its object
 *    and returns the winner's test.
 *  - newSiteName, newSystemName and newJob create records (a site, a system, a visit) inside that
 *    same transaction, so a retry never makes a second one and a failed upload leaves none behind.
 *    They need records.manage, like POST /api/sites (403 naming the field before anything runs).
 *  - The request's signal aborting (the client gone) before the commit leaves nothing behind.
 *  - A log larger than ANALYSIS_JOB_MIN_KB is stored and handed to a queued job instead
 *    (./queued-upload.ts): the answer is the task to follow, and the job commits the test with
 *    commitNewTest below, exactly as a small upload does.
 */
import { entersReviewOnUpload, reviewRowsOfNewTest } from "@/lib/review/auto";
import { uploadInProgress } from "@/lib/jobs/local-load";
import { enqueueMailDelivery } from "@/lib/notify/outbox";
import { randomUUID } from "node:crypto";
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";
import type { Database, Tx } from "@/db/client";
import { getJobById, getSiteById, getSystemById, createJob, createSite, createSystem } from "@/db/queries/records";
import { getIdempotencyKeyByKey, insertNewTestTogether, isIdempotencyKeyTaken, type NewVacuumTestRows, type VacuumTestDetailRow } from "@/db/queries/vacuum-tests";
import { assertSameRequest, requestFingerprint, type SpentKey } from "./idempotency";
import { assertStorableRun } from "./storable-result";
import { analysisRowsOf } from "@/db/queries/analyses";
import { AppError } from "@/lib/errors";
import { can, type Role } from "@/lib/permissions";
import { RAW_LOG_CONTENT_TYPE, rawLogKey } from "@/lib/storage";
import { analyseLog } from "@/lib/engine/door";
import { sha256Hex } from "./files";
import { KeyTaken, storeThenCommit } from "./stored-commit";
import { getTaskByIdempotencyKey } from "@/db/queries/tasks";
import { queueLogAnalysis, queuedReplayOf } from "./queued-upload";
import { compactOptions, importOptionsOf, resolveProfile, volumeOf } from "./options";
import type { VacuumTestMetadata } from "./schemas";
import type { EngineRun } from "./engine";
import type { TaskRow } from "@/db/queries/tasks";
import { env } from "@/lib/env";

export interface Uploader {
  organizationId: string;
  userId: string;
  /** Needed for newJob (records.manage); scripts that never ask for a job may leave it out. */
  role?: Role;
  /** For the leads' e-mail; read from the database when absent. */
  name?: string;
}

export interface UploadInput {
  metadata: VacuumTestMetadata;
  source: "file" | "typed";
  filename: string;
  contentType: string;
  bytes: Uint8Array;
  text: string;
  /** Importer choices the source implies (typed readings name their own columns). */
  importDefaults?: AnalyzeOptions["import"];
  /** The isolation the source implies (typed "minutes since isolation": the first reading). */
  isolationAtSeconds?: number;
  idempotencyKey?: string;
  /** The request's signal: once it aborts (the client went away), nothing is committed. */
  signal?: AbortSignal;
}

export interface UploadOutcome {
  testId: string;
  /** False when an earlier upload with the same Idempotency-Key is returned. */
  created: boolean;
  /** The new test's analysis, already in memory (absent when an earlier upload is returned). */
  result?: AnalysisResult;
  /** The new test with its names, as written (absent when a name was not read here). */
  row?: VacuumTestDetailRow;
  /** A large log: the queued task that will analyse it and make the test (`testId` is the id it will have). */
  task?: TaskRow;
}

/** A raw log as stored, with what the upload said about it (all a test needs besides the analysis). */
export interface StoredLog {
  metadata: VacuumTestMetadata;
  source: "file" | "typed";
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  objectKey: string;
  idempotencyKey?: string;
  /** The request's fingerprint, stored with its Idempotency-Key. */
  fingerprint?: string;
}

type FaultHook = (tx: Tx, ctx: { testId: string; objectKey: string }) => Promise<void>;
let faultBeforeCommit: FaultHook | null = null;

/** Test seam: runs inside the upload transaction just before it commits; a throw rolls it back. */
export function setUploadFaultForTests(hook: FaultHook | null): void {
  faultBeforeCommit = hook;
}

function titleOf(m: VacuumTestMetadata, filename: string, source: "file" | "typed"): string {
  if (m.title) return m.title;
  const where = [m.newSiteName, m.newSystemName].filter(Boolean).join(" — ");
  if (where) return where;
  return source === "typed" ? "Typed readings" : filename.replace(/\.[A-Za-z0-9]{1,5}$/, "") || "Vacuum test";
}

/** A file time with a zone is an instant; one without is wall time we cannot place, so it is not used. */
function testedAtOf(m: VacuumTestMetadata, startedAt: string | null): Date {
  if (m.testedAt) return new Date(m.testedAt);
  if (startedAt && /(Z|[+-]\d\d:?\d\d)$/.test(startedAt)) {
    const d = new Date(startedAt);
    if (!Number.isNaN(d.getTime()) && d.getTime() <= Date.now() + 86_400_000) return d;
  }
  return new Date();
}

/** The visit's date: the technician's own calendar date if sent, else the test's date in UTC. */
function visitedOnOf(m: VacuumTestMetadata, testedAt: Date): string {
  return m.newJobVisitedOn ?? testedAt.toISOString().slice(0, 10);
}

/** Names learnt while checking or creating the records; undefined: not read here. */
interface RecordNames {
  siteName: string | null | undefined;
  systemName: string | null | undefined;
  job: { reference: string | null; visitedOn: string; reason: string | null } | null | undefined;
}

async function checkRecords(tx: Tx, who: Uploader, m: VacuumTestMetadata, testedAt: Date) {
  const org = who.organizationId;
  const names: RecordNames = { siteName: null, systemName: null, job: null };
  if (m.jobId) {
    const job = await getJobById(tx, { organizationId: org, jobId: m.jobId });
    if (!job) throw new AppError("invalid_input", "jobId: no such job in your organization", { field: "jobId" });
    names.job = job;
  }
  let siteId = m.siteId ?? null;
  if (siteId) {
    const site = await getSiteById(tx, { organizationId: org, siteId });
    if (!site) throw new AppError("invalid_input", "siteId: no such site in your organization", { field: "siteId" });
    names.siteName = site.name;
  }
  let systemId = m.systemId ?? null;
  if (systemId) {
    const system = await getSystemById(tx, { organizationId: org, systemId });
    if (!system) throw new AppError("invalid_input", "systemId: no such system in your organization", { field: "systemId" });
    if (siteId && system.siteId !== siteId) throw new AppError("invalid_input", "systemId: that system is at another site", { field: "systemId" });
    if (!siteId) names.siteName = undefined; // the system's site, not read here
    siteId ??= system.siteId;
    names.systemName = system.name;
  }
  if (m.newSiteName) {
    siteId = (await createSite(tx, { organizationId: org, name: m.newSiteName })).id;
    names.siteName = m.newSiteName;
  }
  if (m.newSystemName && siteId) {
    const system = await createSystem(tx, {
      organizationId: org,
      siteId,
      name: m.newSystemName,
      refrigerant: m.refrigerant ?? null,
      lineSetFeet: m.lineSetFeet ?? null,
      liquidOd: m.liquidOd ?? null,
      suctionOd: m.suctionOd ?? null,
    });
    systemId = system.id;
    names.systemName = system.name;
  }
  let jobId = m.jobId ?? null;
  if (m.newJob) {
    const job = await createJob(tx, { organizationId: org, visitedOn: visitedOnOf(m, testedAt), siteId, systemId, technicianId: who.userId, reason: m.newJobReason ?? null });
    jobId = job.id;
    names.job = job;
  }
  return { siteId, systemId, jobId, names };
}

/**
 * The new test as GET would read it, from what the upload wrote and learnt, so the answer needs
 * no read-back; undefined when a name was not read here (the caller then reads the row).
 */
function answerRowOf(test: VacuumTestDetailRow["test"], who: Uploader, names: RecordNames): VacuumTestDetailRow | undefined {
  if (who.name === undefined || names.siteName === undefined || names.systemName === undefined || names.job === undefined) return undefined;
  return {
    test,
    createdByName: who.name,
    siteName: names.siteName,
    systemName: names.systemName,
    jobReference: names.job?.reference ?? null,
    jobVisitedOn: names.job?.visitedOn ?? null,
    jobReason: names.job?.reason ?? null,
  };
}

/** The fields of an upload that create records, and what each creates. */
const CREATING_FIELDS = [
  ["newSiteName", "sites", "pick an existing site"],
  ["newSystemName", "systems", "pick an existing system"],
  ["newJob", "jobs", "upload without a new visit"],
] as const;

/**
 * newSiteName, newSystemName and newJob need records.manage (owner, lead, technician), as the
 * records routes do: checked before anything is analysed or stored. Scripts that pass no role
 * (the seed) are trusted.
 */
function assertMayCreateRecords(who: Uploader, m: VacuumTestMetadata): void {
  if (!who.role || can(who.role, "records.manage")) return;
  for (const [field, what, instead] of CREATING_FIELDS) {
    if (m[field])
      throw new AppError("forbidden", `${field}: your role (${who.role}) cannot create ${what}; ${instead}, or ask a technician or lead to add it.`, { field });
  }
}

/** The engine options of a new test: importer choices, the profile, the volume, the ambient. */
export async function uploadOptionsOf(db: Database, org: string, input: UploadInput): Promise<AnalyzeOptions> {
  const m = input.metadata;
  const profile = await resolveProfile(db, { organizationId: org, profileId: m.profileId });
  const overrides = importOptionsOf(m);
  const imp = input.importDefaults || overrides ? { ...(input.importDefaults ?? {}), ...(overrides ?? {}) } : undefined;
  return compactOptions({ import: imp, profile, volume: volumeOf(m), ambientC: m.ambientC, isolationAtSeconds: input.isolationAtSeconds });
}

/** The first upload for a key already used by this person for this same request (422 otherwise). */
function replayOf(seen: SpentKey, fingerprint: string): UploadOutcome {
  assertSameRequest(seen, fingerprint);
  if (seen.analysisId)
    throw new AppError("idempotency_mismatch", "Idempotency-Key: you already used this key for a re-test upload; send a new key for a new test.", { field: "Idempotency-Key" });
  return { testId: seen.testId, created: false };
}

/** What an upload means, for its Idempotency-Key's fingerprint. */
function fingerprintOf(input: UploadInput, sha256: string): string {
  return requestFingerprint("POST /api/tests", { source: input.source, sha256, filename: input.filename, metadata: input.metadata, importDefaults: input.importDefaults });
}

/** Run the whole pipeline for one upload. Throws LogError (422) or AppError. */
export async function createTestFromUpload(db: Database, who: Uploader, input: UploadInput): Promise<UploadOutcome> {
  const answered = uploadInProgress();
  try {
    return await uploadPipeline(db, who, input);
  } finally {
    answered();
  }
}

async function uploadPipeline(db: Database, who: Uploader, input: UploadInput): Promise<UploadOutcome> {
  const org = who.organizationId;
  const sha256 = sha256Hex(input.bytes);
  const fingerprint = fingerprintOf(input, sha256);
  const keyOf = { organizationId: org, userId: who.userId, key: input.idempotencyKey ?? "" };
  if (input.idempotencyKey) {
    const seen = await getIdempotencyKeyByKey(db, keyOf);
    if (seen) return replayOf(seen, fingerprint);
    const queued = await getTaskByIdempotencyKey(db, keyOf);
    if (queued) return queuedReplayOf(queued, fingerprint);
  }
  assertMayCreateRecords(who, input.metadata);
  const options = await uploadOptionsOf(db, org, input);
  if (input.text.length > env().ANALYSIS_JOB_MIN_KB * 1024) return queueLogAnalysis(db, who, input, options, { sha256, fingerprint });
  const run = await analyseLog(input.text, options); // LogError → 422 before anything is stored
  assertStorableRun(run); // numbers no column can hold → 422, not a failed insert

  const testId = randomUUID();
  const analysisId = randomUUID();
  const objectKey = rawLogKey(org, testId, input.filename);
  const object = { key: objectKey, bytes: input.bytes, filename: input.filename, sha256 };

  const log: StoredLog = {
    metadata: input.metadata, source: input.source, filename: input.filename, contentType: input.contentType,
    sizeBytes: input.bytes.byteLength, sha256, objectKey, idempotencyKey: input.idempotencyKey, fingerprint,
  };
  return storeThenCommit<UploadOutcome>(
    db,
    object,
    "raw log",
    (tx) => commitNewTest(tx, who, log, { testId, analysisId, options, run }),
    async () => {
      // Lost the race for the key: answer with the winner's test.
      const seen = await getIdempotencyKeyByKey(db, keyOf);
      if (seen) return replayOf(seen, fingerprint);
      throw new AppError("conflict", "The same upload is being saved by another request; try again.");
    },
    input.signal,
  );
}

/**
 * Inside the caller's transaction: the new test of an analysed, stored log with everything that
 * goes with it (records, review rule, audit event, the leads' e-mail and its delivery job, the
 * Idempotency-Key). A key already taken throws KeyTaken.
 */
export async function commitNewTest(
  tx: Tx,
  who: Uploader,
  log: StoredLog,
  a: { testId: string; analysisId: string; options: AnalyzeOptions; run: EngineRun },
): Promise<UploadOutcome> {
  const org = who.organizationId;
  const { testId, run } = a;
  const testedAt = testedAtOf(log.metadata, run.startedAt);
  const { siteId, systemId, jobId, names } = await checkRecords(tx, who, log.metadata, testedAt);
  // Not a pass, misses the profile or help asked: the test is inserted straight into the
  // lead's queue, and its audit event and the leads' e-mail are queued in the same commit.
  const title = titleOf(log.metadata, log.filename, log.source);
  const known = {
    verdict: run.result.verdict, meetsProfile: run.result.meetsProfile, helpRequested: false, isPractice: log.metadata.isPractice,
    title, technicianName: who.name, siteName: names.siteName,
  };
  const review = (await entersReviewOnUpload(tx, known)) ? await reviewRowsOfNewTest(tx, { organizationId: org, testId, technicianId: who.userId, siteId, known }) : null;
  const rows = newTestRows({ who, log, testId, analysisId: a.analysisId, siteId, systemId, jobId, title, options: a.options, result: run.result, series: run.series, testedAt, review });
  const inserted = await insertNewTestTogether(tx, rows).catch((err: unknown) => {
    throw isIdempotencyKeyTaken(err) ? new KeyTaken() : err;
  });
  // The leads' e-mail is delivered by a job that commits with the test (it never holds up the verdict).
  await enqueueMailDelivery(tx, { organizationId: org, ids: rows.mails.map((m) => m.id) });
  if (faultBeforeCommit) await faultBeforeCommit(tx, { testId, objectKey: log.objectKey });
  return { testId, created: true, result: run.result, row: answerRowOf(inserted, who, names) };
}

interface NewTestArgs {
  who: Uploader;
  log: StoredLog;
  testId: string;
  analysisId: string;
  siteId: string | null;
  systemId: string | null;
  jobId: string | null;
  title: string;
  options: AnalyzeOptions;
  result: AnalysisResult;
  series: { t: number[]; p: number[] };
  testedAt: Date;
  /** The rule's rows when the test goes straight into review; null: it is only submitted. */
  review: Awaited<ReturnType<typeof reviewRowsOfNewTest>> | null;
}

/** Every row of a new test, for insertNewTestTogether. */
function newTestRows(a: NewTestArgs): NewVacuumTestRows {
  const m = a.log.metadata;
  const org = a.who.organizationId;
  const analysis = analysisRowsOf({
    id: a.analysisId, organizationId: org, testId: a.testId, version: 1, options: a.options, result: a.result, series: a.series, createdById: a.who.userId,
  });
  return {
    test: {
      id: a.testId,
      organizationId: org,
      createdById: a.who.userId,
      jobId: a.jobId,
      siteId: a.siteId,
      systemId: a.systemId,
      title: a.title,
      source: a.log.source,
      refrigerant: m.refrigerant ?? null,
      lineSetFeet: m.lineSetFeet ?? null,
      liquidOd: m.liquidOd ?? null,
      suctionOd: m.suctionOd ?? null,
      volumeLitres: m.volumeLitres ?? null,
      ambientC: m.ambientC ?? null,
      rigNote: m.rigNote ?? null,
      notes: m.notes ?? null,
      customerNote: m.customerNote ?? null,
      isPractice: m.isPractice,
      verdict: a.result.verdict,
      currentAnalysisId: a.analysisId,
      status: a.review ? "waiting_review" : "submitted",
      testedAt: a.testedAt,
    },
    upload: {
      organizationId: org,
      testId: a.testId,
      objectKey: a.log.objectKey,
      sha256: a.log.sha256,
      sizeBytes: a.log.sizeBytes,
      filename: a.log.filename,
      contentType: RAW_LOG_CONTENT_TYPE, // stored and served as this, whatever the browser claimed
    },
    analysis: analysis.analysis,
    findings: analysis.findings,
    events: a.review ? [a.review.event] : [],
    mails: a.review?.mails ?? [],
    idempotencyKey: a.log.idempotencyKey
      ? { organizationId: org, key: a.log.idempotencyKey, userId: a.who.userId, testId: a.testId, requestFingerprint: a.log.fingerprint ?? null }
      : null,
  };
}

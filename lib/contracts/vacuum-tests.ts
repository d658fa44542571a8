/**
 * What the vacuum-test API answers (GET/POST /api/tests, GET /api/tests/:id), as zod schemas and
 * the types inferred from them. The server builds these shapes (lib/tests/dto.ts, read.ts) and
 * the client reads them (lib/client/api.ts); tests/contracts.test.ts parses real answers with them.
 * Dates travel as ISO 8601 strings. Plain module: safe in the browser bundle.
 */
import { z } from "zod";
import type { AnalysisResult, AnalyzeOptions } from "@/analysis/decay/types";
import { TEST_SOURCES, TEST_STATUSES, VERDICTS } from "@/db/vocabulary";

export const testStatusSchema = z.enum(TEST_STATUSES);
export const verdictSchema = z.enum(VERDICTS);

const person = z.strictObject({ id: z.string(), name: z.string() });
const named = z.strictObject({ id: z.string(), name: z.string() });

/** The engine's whole result; its shape is the engine's type (analysis/types.ts), checked there. */
export const analysisResultSchema = z.custom<AnalysisResult>((v) => typeof v === "object" && v !== null && "verdict" in v, "not an analysis result");

/** One test record as the pages show it. */
export const testDtoSchema = z.strictObject({
  id: z.string(),
  title: z.string(),
  source: z.enum(TEST_SOURCES),
  status: testStatusSchema,
  verdict: verdictSchema.nullable(),
  isPractice: z.boolean(),
  helpRequested: z.boolean(),
  testedAt: z.string(),
  createdAt: z.string(),
  technician: person,
  job: z.strictObject({ id: z.string(), reference: z.string().nullable(), visitedOn: z.string().nullable(), reason: z.string().nullable() }).nullable(),
  site: named.nullable(),
  system: named.nullable(),
  refrigerant: z.string().nullable(),
  lineSetFeet: z.number().nullable(),
  liquidOd: z.string().nullable(),
  suctionOd: z.string().nullable(),
  volumeLitres: z.number().nullable(),
  ambientC: z.number().nullable(),
  notes: z.string().nullable(),
  /** For the customer's copy of the report; `notes` stay internal. */
  customerNote: z.string().nullable(),
  rigNote: z.string().nullable(),
  currentAnalysisId: z.string().nullable(),
});
export type VacuumTestDto = z.infer<typeof testDtoSchema>;

/** A row of the tests list. */
export const testListItemSchema = z.strictObject({
  id: z.string(),
  title: z.string(),
  verdict: verdictSchema.nullable(),
  confidence: z.number().nullable(),
  status: testStatusSchema,
  testedAt: z.string(),
  technician: person,
  site: named.nullable(),
  systemName: z.string().nullable(),
  isPractice: z.boolean(),
  startMicrons: z.number().nullable(),
  endMicrons: z.number().nullable(),
  leakRateMicronsPerMinute: z.number().nullable(),
  /** Whether the current analysis met the shop's profile (null when not analysed or hidden). */
  meetsProfile: z.boolean().nullable(),
  findingCodes: z.array(z.string()),
});
export type VacuumTestListItem = z.infer<typeof testListItemSchema>;

/** GET /api/tests: one page of the list and the cursor of the next (null on the last). */
export const testPageSchema = z.strictObject({ items: z.array(testListItemSchema), nextCursor: z.string().nullable() });
export type TestPage = z.infer<typeof testPageSchema>;

/** One analysis version in a test's history. */
export const analysisHistoryEntrySchema = z.strictObject({
  id: z.string(),
  version: z.number().int(),
  verdict: verdictSchema,
  confidence: z.number(),
  meetsProfile: z.boolean().nullable(),
  createdAt: z.string(),
  createdBy: person,
  reason: z.string().nullable(),
  /** The options the version was analysed with (analysis/types.ts AnalyzeOptions). */
  options: z.custom<AnalyzeOptions>((v) => typeof v === "object" && v !== null, "not analysis options").nullable(),
});
export type AnalysisHistoryEntry = z.infer<typeof analysisHistoryEntrySchema>;

/** The stored raw file's facts (null for typed readings). */
export const uploadFactsSchema = z.strictObject({ filename: z.string(), sizeBytes: z.number().int(), sha256: z.string() });

/** Which analysis version a detail shows, out of how many the test has. */
export const shownAnalysisSchema = z.strictObject({
  analysisId: z.string(),
  version: z.number().int(),
  versionCount: z.number().int(),
  /** The shown version is the test's current analysis. */
  isCurrent: z.boolean(),
});
export type ShownAnalysis = z.infer<typeof shownAnalysisSchema>;

/** GET /api/tests/:id; with ?analysisId= also `shown`. */
export const testDetailSchema = z.strictObject({
  test: testDtoSchema,
  analysis: analysisResultSchema,
  /** t: seconds from the first data row; p: microns. */
  series: z.strictObject({ t: z.array(z.number()), p: z.array(z.number()) }),
  history: z.array(analysisHistoryEntrySchema),
  upload: uploadFactsSchema.nullable(),
  shown: shownAnalysisSchema.optional(),
});
export type VacuumTestDetail = z.infer<typeof testDetailSchema>;

/**
 * POST /api/tests (201 new, 200 retried): the test with its verdict — or an apprentice's practice
 * test, whose verdict waits for their call at `practiceCallUrl`.
 */
export const testSummarySchema = z.union([
  z.strictObject({ test: testDtoSchema, analysis: analysisResultSchema, practiceCallUrl: z.undefined().optional() }),
  z.strictObject({ test: testDtoSchema, analysis: z.null(), practiceCallUrl: z.string() }),
]);
export type VacuumTestSummary = z.infer<typeof testSummarySchema>;

/**
 * The words a vacuum test's record is made of, declared once: the database's CHECK constraints,
 * the server's answers and the client's types all come from these lists. Plain module: no
 * server-only imports and no zod (the schemas are in vacuum-tests.ts), cheap in the browser bundle.
 */
import type { Verdict } from "@/analysis/decay/types";

/** Where a test stands in review. */
export const TEST_STATUSES = ["submitted", "waiting_review", "signed_off", "sent_back"] as const;
export type TestStatus = (typeof TEST_STATUSES)[number];

/** The engine's verdicts (analysis/types.ts `Verdict`), as the database stores them. */
export const VERDICTS = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"] as const satisfies readonly Verdict[];

// Fails to compile if the engine grows a verdict this list lacks.
type MissingVerdict = Exclude<Verdict, (typeof VERDICTS)[number]>;
const everyVerdictListed: MissingVerdict extends never ? true : never = true;
void everyVerdictListed;

/** How the readings came in: a gauge's file, or typed by hand. */
export const TEST_SOURCES = ["file", "typed"] as const;
export type TestSource = (typeof TEST_SOURCES)[number];

/** A nitrogen pressure test's verdict. */
export const PRESSURE_VERDICTS = ["holds", "drops", "rises", "stopped"] as const;
export type PressureVerdict = (typeof PRESSURE_VERDICTS)[number];

/** An apprentice's call on a practice test: a verdict, never "inconclusive". */
export const PRACTICE_CALLS = ["pass", "leak", "moisture", "leak_and_moisture", "inconclusive"] as const satisfies readonly Verdict[];
export type PracticeCall = (typeof PRACTICE_CALLS)[number];

export type { Verdict };

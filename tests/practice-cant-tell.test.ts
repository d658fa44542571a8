/**
 * "Can't tell" is an honest practice answer (training practice, common practice, no published
 * source): stored as `inconclusive`, matched only when the analysis could not tell either.
 */
import { describe, expect, it } from "vitest";
import { POST as callPost } from "@/app/api/practice/tests/[id]/call/route";
import { PRACTICE_CALL_WORDS } from "@/lib/practice/words";
import { appRequest, routeParams, type TestMember } from "./helpers/members";
import { crewForFile, jsonInit } from "./helpers/crew";
import { seedTest } from "./helpers/seed-test";

const crew = crewForFile();
const call = (id: string, as: TestMember, body: unknown) => callPost(appRequest(`/api/practice/tests/${id}/call`, jsonInit(as, body)), routeParams({ id }));

describe("a 'Can't tell' practice call", () => {
  it("is accepted, reads as words, matches an unclear analysis and not a leak", async () => {
    expect(PRACTICE_CALL_WORDS.inconclusive).toBe("Can't tell");
    const unclear = await seedTest(crew.apprentice, { verdict: "inconclusive", isPractice: true, title: "Practice: short hold" });
    const leak = await seedTest(crew.apprentice, { verdict: "leak", isPractice: true, title: "Practice: garage split" });
    const a = await call(unclear, crew.apprentice, { call: "inconclusive", reason: "The hold is too short to say." });
    expect(a.status).toBe(201);
    expect((await a.json()).call).toMatchObject({ call: "inconclusive", analysisVerdict: "inconclusive", matched: true });
    const b = await call(leak, crew.apprentice, { call: "inconclusive", reason: "Could be either." });
    expect((await b.json()).call).toMatchObject({ call: "inconclusive", analysisVerdict: "leak", matched: false });
  });
});

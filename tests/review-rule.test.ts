/**
 * The review rule is one SQL predicate (db/queries/review.ts): what the upload asks of a test it is
 * about to insert is the rule the queue applies to stored rows. Our own product rule, no published
 * source: a test that is not a pass, misses its profile or asks for help waits for a lead; practice
 * runs never do.
 */
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { entersReviewOnUpload } from "@/db/queries/review";

const CASES = [
  { verdict: "pass", meetsProfile: true, helpRequested: false, isPractice: false, due: false },
  { verdict: "leak", meetsProfile: true, helpRequested: false, isPractice: false, due: true },
  { verdict: "pass", meetsProfile: false, helpRequested: false, isPractice: false, due: true },
  { verdict: "pass", meetsProfile: null, helpRequested: false, isPractice: false, due: true },
  { verdict: "pass", meetsProfile: true, helpRequested: true, isPractice: false, due: true },
  { verdict: "moisture", meetsProfile: false, helpRequested: true, isPractice: true, due: false },
] as const;

describe("one review rule (our own product rule, no published source)", () => {
  it.each(CASES)("verdict $verdict, meets profile $meetsProfile, help $helpRequested, practice $isPractice → due $due", async ({ due, ...k }) => {
    expect(await entersReviewOnUpload(db(), k)).toBe(due);
  });
});

/**
 * The overlay: up to eight tests on one chart, aligned at isolation, with their numbers side
 * by side. Visibility applies: tests the viewer cannot see are left out with a note, and when
 * none is visible the answer is 404. An apprentice's uncalled practice test shows its curve only.
 */
import { z } from "zod";
import type { Decay, Verdict } from "@/analysis/decay/types";
import type { Db } from "@/db/client";
import { listOverlayTestsByIds } from "@/db/queries/overlay";
import type { Viewer } from "@/db/queries/visibility";
import { AppError } from "@/lib/errors";
import { hiddenPracticeTestIds } from "@/lib/practice/gate";
import { alignAtIsolation } from "./align";

import { OVERLAY_MAX_TESTS } from "./limits";

export { OVERLAY_MAX_TESTS };

/** ?tests=id1,id2,… — 1 to 8 distinct test ids. */
export const overlayQuery = z.object({
  tests: z
    .string({ error: "give the tests to compare: ?tests=id1,id2" })
    .transform((s) => [...new Set(s.split(",").map((x) => x.trim()).filter(Boolean))])
    .pipe(
      z
        .array(z.string().uuid("not a valid test id"))
        .min(1, "give at least one test")
        .max(OVERLAY_MAX_TESTS, `compare at most ${OVERLAY_MAX_TESTS} tests`),
    ),
});

export interface OverlayTest {
  id: string;
  title: string;
  testedAt: string;
  technicianName: string;
  /** Seconds from the first data row, or null when the log starts in the hold (zero = first reading). */
  isolationAt: number | null;
  zeroSeconds: number;
  /** The reading at time zero: the baseline of the "rise" view. */
  zeroMicrons: number;
  /** Seconds from isolation and microns. */
  aligned: { t: number[]; p: number[] };
  analysisHidden: boolean;
  verdict: Verdict | null;
  meetsProfile: boolean | null;
  decay: Decay | null;
}

export interface OverlayResult {
  tests: OverlayTest[];
  /** Requested ids left out because the viewer cannot see them (or they do not exist). */
  omittedIds: string[];
  note: string | null;
}

export async function loadOverlay(db: Db, viewer: Viewer, testIds: string[]): Promise<OverlayResult> {
  const rows = await listOverlayTestsByIds(db, { viewer, testIds });
  if (rows.length === 0) throw new AppError("not_found", "None of these tests is visible to you.");
  const hidden = await hiddenPracticeTestIds(db, { organizationId: viewer.organizationId, userId: viewer.userId, role: viewer.role, testIds: rows.map((r) => r.id) });
  const byId = new Map(rows.map((r) => [r.id, r]));
  const tests: OverlayTest[] = [];
  const omittedIds: string[] = [];
  for (const id of testIds) {
    const r = byId.get(id);
    if (!r) {
      omittedIds.push(id);
      continue;
    }
    const isHidden = hidden.has(id);
    // A hidden practice test is aligned at its first reading: its isolation point is part of the answer.
    const isolationAt = isHidden ? null : r.result.isolationAt;
    const a = alignAtIsolation(r.series, isolationAt);
    tests.push({
      id,
      title: r.title,
      testedAt: r.testedAt.toISOString(),
      technicianName: r.technicianName,
      isolationAt,
      zeroSeconds: a.zeroSeconds,
      zeroMicrons: a.zeroMicrons,
      aligned: { t: a.t, p: a.p },
      analysisHidden: isHidden,
      verdict: isHidden ? null : r.result.verdict,
      meetsProfile: isHidden ? null : r.result.meetsProfile,
      decay: isHidden ? null : r.result.decay,
    });
  }
  const note = omittedIds.length
    ? `${omittedIds.length} of the ${testIds.length} tests ${omittedIds.length === 1 ? "is" : "are"} not shown: not found, or not shared with you.`
    : null;
  return { tests, omittedIds, note };
}

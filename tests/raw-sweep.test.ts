/**
 * The orphan raw-file sweeper (lib/jobs/raw-sweep.ts, our rule): a stored raw log that no committed
 * upload row (nor a queued large-log analysis) names is deleted once it is older than the safe age;
 * a referenced one, or a young one, is never touched. Real S3 fake and PostgreSQL.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { insertTask } from "@/db/queries/tasks";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";
import { sweepOrphanRawFiles } from "@/lib/jobs/raw-sweep";
import { putRawLog, rawLogKey } from "@/lib/storage";
import { crewForFile } from "./helpers/crew";
import { listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();
const HOUR = 3600;

describe("orphan raw-file sweeper (our rule)", () => {
  it("deletes old unreferenced files only: a committed test's file, a queued analysis' file and a young orphan stay", async () => {
    const org = crew.owner.organizationId;
    const res = await uploadPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText("sample-1-iso-microns.csv"), name: "kept.csv" } }));
    expect(res.status).toBe(201);
    const [committed] = await listKeys(`orgs/${org}/tests/${(await res.json()).test.id}/`);
    const orphan = rawLogKey(org, randomUUID(), "orphan.csv");
    const queued = rawLogKey(org, randomUUID(), "queued.csv");
    for (const key of [orphan, queued]) await putRawLog(key, new TextEncoder().encode("t,p\n0,500\n"), "log.csv", "0".repeat(64));
    await insertTask(db(), { id: randomUUID(), organizationId: org, requestedById: crew.technician.userId, kind: "log_analysis", input: {}, objectKey: queued });

    // Just stored: younger than the safe age, so nothing goes.
    const young = await sweepOrphanRawFiles(db(), { safeAgeSeconds: HOUR, prefix: `orgs/${org}/` });
    expect(young.deleted).toEqual([]);

    // Two hours later (the clock moved, not the files; this shop's files only, as other test files upload meanwhile).
    const later = await sweepOrphanRawFiles(db(), { safeAgeSeconds: HOUR, now: new Date(Date.now() + 2 * HOUR * 1000), prefix: `orgs/${org}/` });
    expect(later.deleted).toEqual([orphan]);
    expect(later.examined).toBe(3);
    const left = await listKeys(`orgs/${org}/`);
    expect(left).toContain(committed);
    expect(left).toContain(queued);
    expect(left).not.toContain(orphan);
  });
});

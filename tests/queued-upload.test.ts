/**
 * Large logs and bulk re-analysis as followed background jobs (lib/vacuum-tests/queued-upload.ts,
 * lib/vacuum-tests/bulk-reanalysis.ts; our rules). A log over ANALYSIS_JOB_MIN_KB answers 202 with a
 * task; the job analyses it and makes the test, exactly as the engine on the request thread
 * would; an unreadable one ends the task with the importer's words and leaves nothing stored. A
 * profile's re-check gives every test of it a new analysis version. Real PostgreSQL, pg-boss, S3 fake.
 */
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";
import { GET as testGet } from "@/app/api/vacuum-tests/[id]/route";
import { GET as taskGet } from "@/app/api/tasks/[id]/route";
import { POST as profilePost } from "@/app/api/settings/profiles/route";
import { PUT as profilePut } from "@/app/api/settings/profiles/[id]/route";
import { POST as recheckPost } from "@/app/api/settings/profiles/[id]/reanalysis/route";
import { env } from "@/lib/env";
import { runAnalysis } from "@/lib/vacuum-tests/engine";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { listKeys, sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();
jobRunnerForFile();

/**
 * A 30-hour log at 1 Hz (about 1.4 MB; invented): a pull-down to about 300 microns, then a hold
 * that settles near 380, as a data logger left on a standing system writes it. Over the 1 MB default.
 */
function longLogText(): string {
  const rows = ["elapsed_s,vacuum_microns"];
  for (let t = 0; t < 30 * 3600; t++) {
    const p = t < 1800 ? 300 + 19700 * Math.exp(-t / 240) : 300 + 80 * (1 - Math.exp(-(t - 1800) / 900));
    rows.push(`${t},${p.toFixed(1)}`);
  }
  return rows.join("\n") + "\n";
}
const longLog = longLogText();

async function followTask(id: string, as: TestMember) {
  let task: { state: string; stage: string; testId: string | null; error: string | null; errorDetails: Record<string, unknown> | null; done: number; total: number; failedItems: number } | undefined;
  const stages = new Set<string>();
  await expect
    .poll(async () => {
      task = (await (await taskGet(appRequest(`/api/tasks/${id}`, { as }), routeParams({ id }))).json()).task;
      stages.add(task!.stage);
      return task!.state;
    }, { timeout: 60_000, interval: 100 })
    .toMatch(/^(done|failed)$/);
  return { task: task!, stages };
}

describe("large logs as queued analysis jobs (our rule)", () => {
  it("answers 202 with a task; the job makes the test with the same analysis the engine gives, and a retry finds it", async () => {
    expect(longLog.length).toBeGreaterThan(env().ANALYSIS_JOB_MIN_KB * 1024);
    const key = randomUUID();
    const send = () => uploadPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: longLog, name: "overnight.csv" }, fields: { title: "Overnight hold" }, headers: { "idempotency-key": key } }));
    const res = await send();
    expect(res.status).toBe(202);
    const { task } = await res.json();
    expect(task).toMatchObject({ kind: "log_analysis", testId: null });
    expect(JSON.stringify(task)).not.toContain("overnight.csv"); // the task's input stays on the server
    const again = await send(); // a retry while (or after) it runs: the same task, never a second test
    expect([200, 202]).toContain(again.status);

    const { task: finished } = await followTask(task.id, crew.technician);
    expect(finished.state).toBe("done");
    expect(finished.done).toBe(1);
    const detail = await (await testGet(appRequest(`/api/vacuum-tests/${finished.testId}`, { as: crew.technician }), routeParams({ id: finished.testId! }))).json();
    expect(detail.test.title).toBe("Overnight hold");
    expect(detail.analysis).toEqual(runAnalysis(longLog, detail.history[0].options).result);
    expect(await listKeys(`orgs/${crew.owner.organizationId}/tests/${finished.testId}/`)).toHaveLength(1);

    const replay = await send();
    expect(replay.status).toBe(200);
    expect((await replay.json()).test.id).toBe(finished.testId);
    // Another shop does not see the task; a trainer of this shop (sees every test) does.
    const outsider = await createShop();
    expect((await taskGet(appRequest(`/api/tasks/${task.id}`, { as: outsider }), routeParams({ id: task.id }))).status).toBe(404);
    expect((await taskGet(appRequest(`/api/tasks/${task.id}`, { as: crew.trainer }), routeParams({ id: task.id }))).status).toBe(200);
  });

  it("an unreadable large log ends the task failed with the importer's words; its file is deleted and no test is made", async () => {
    const junk = "time,microns\n" + Array.from({ length: 150_000 }, (_, i) => `${i},abc`).join("\n") + "\n";
    const res = await uploadPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: junk, name: "junk.csv" } }));
    expect(res.status).toBe(202);
    const { task } = await res.json();
    const { task: finished, stages } = await followTask(task.id, crew.technician);
    expect(finished.state).toBe("failed");
    expect(stages.has("done")).toBe(false);
    expect(finished.error).toMatch(/usable readings/);
    expect(finished.errorDetails?.reason).toBeTruthy();
    expect(finished.testId).toBeNull();
    const keys = await listKeys(`orgs/${crew.owner.organizationId}/tests/`);
    expect(keys.some((k) => k.endsWith("/junk.csv"))).toBe(false);
  });
});

describe("re-checking a profile's tests after an edit (our rule)", () => {
  it("gives every test judged by the profile a new analysis with the edited numbers, and counts them", async () => {
    const shop = await createShop();
    const body = { name: "House rule", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1000, leakRateMicronsPerMinute: 20, makeDefault: true };
    const made = await profilePost(appRequest("/api/settings/profiles", jsonInit(shop, body)));
    expect(made.status).toBe(201);
    const profileId = (await made.json()).profile.id;
    const ids: string[] = [];
    for (const name of ["sample-1-iso-microns.csv", "sample-2-elapsed-mtorr.csv", "sample-4-minutes-torr.csv"]) {
      const r = await uploadPost(uploadRequest("/api/vacuum-tests", { as: shop, file: { body: sampleText(name), name } }));
      expect(r.status).toBe(201);
      ids.push((await r.json()).test.id);
    }
    const edited = await profilePut(appRequest(`/api/settings/profiles/${profileId}`, jsonInit(shop, { ...body, name: "House rule, strict", limitMicrons: 600 }, "PUT")), routeParams({ id: profileId }));
    expect(edited.status).toBe(200);
    const res = await recheckPost(appRequest(`/api/settings/profiles/${profileId}/reanalysis`, jsonInit(shop, { previousName: "House rule" })), routeParams({ id: profileId }));
    expect(res.status).toBe(202);
    const { task } = await res.json();
    expect(task).toMatchObject({ kind: "bulk_reanalysis", total: 3 });
    const { task: finished } = await followTask(task.id, shop);
    expect(finished).toMatchObject({ state: "done", done: 3, failedItems: 0 });
    for (const id of ids) {
      const detail = await (await testGet(appRequest(`/api/vacuum-tests/${id}`, { as: shop }), routeParams({ id }))).json();
      const history = [...detail.history].sort((a: { version: number }, b: { version: number }) => b.version - a.version);
      expect(history.map((h: { version: number }) => h.version)).toEqual([2, 1]);
      expect(history[0].options.profile).toMatchObject({ name: "House rule, strict", limitMicrons: 600 });
      expect(detail.analysis.profile).toMatchObject({ limitMicrons: 600 });
    }
    // A profile no test was judged by has nothing to re-check.
    const unused = await profilePost(appRequest("/api/settings/profiles", jsonInit(shop, { ...body, name: "Never used", makeDefault: false })));
    const unusedId = (await unused.json()).profile.id;
    const none = await recheckPost(appRequest(`/api/settings/profiles/${unusedId}/reanalysis`, jsonInit(shop, {})), routeParams({ id: unusedId }));
    expect(none.status).toBe(200);
    expect((await none.json()).task).toBeNull();
    expect((await recheckPost(appRequest(`/api/settings/profiles/${profileId}/reanalysis`, jsonInit(crew.technician, {})), routeParams({ id: profileId }))).status).toBe(403);
  });
});

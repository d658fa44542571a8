/**
 * The job runner stops gracefully (our contract, lib/jobs/runner.ts): a job in flight that ends
 * within the stop's time limit finishes; one that does not goes back to the queue for another
 * try, never left "active" for a dead process. `npm run worker` runs jobs on its own and exits
 * cleanly on SIGTERM. Real PostgreSQL and pg-boss.
 */
import { spawn } from "node:child_process";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { ensureJobStore, jobSender, sendJob } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { startJobRunner } from "@/lib/jobs/runner";
import { queueMail } from "@/lib/notify/outbox";
import { crewForFile } from "./helpers/crew";
import { waitForMail } from "./helpers/mailbox";
import { uniqueEmail } from "./helpers/members";

const crew = crewForFile();
const SLOW = "test-slow-work";
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function stateOf(id: string): Promise<string | undefined> {
  return (await jobSender().getJobById(SLOW, id))?.state;
}

describe("job runner shutdown (our contract)", () => {
  it("lets a job in flight finish when it ends within the limit, and puts one back in the queue when it does not", async () => {
    await ensureJobStore();
    await jobSender().createQueue(SLOW, { name: SLOW, retryLimit: 3, retryDelay: 1, expireInSeconds: 60 });
    let started = 0;
    const runner = await startJobRunner("test", [{ queue: SLOW, pollingIntervalSeconds: 0.5, run: async (job) => {
      started++;
      await sleep((job.data as { ms: number }).ms);
    } }], []);
    const quick = await sendJob(db(), SLOW as never, { ms: 1500 });
    await expect.poll(() => stateOf(quick), { timeout: 10_000, interval: 100 }).toBe("active");
    await runner.stop({ timeoutMs: 8000 });
    expect(await stateOf(quick)).toBe("completed");

    const runner2 = await startJobRunner("test", [{ queue: SLOW, pollingIntervalSeconds: 0.5, run: (job) => sleep((job.data as { ms: number }).ms) }], []);
    const long = await sendJob(db(), SLOW as never, { ms: 20_000 });
    await expect.poll(() => stateOf(long), { timeout: 10_000, interval: 100 }).toBe("active");
    const t0 = Date.now();
    await runner2.stop({ timeoutMs: 1000 });
    expect(Date.now() - t0).toBeLessThan(5000);
    expect(await stateOf(long)).toBe("retry"); // back in the queue, for the next runner
    expect(started).toBe(1);
  });

  it("npm run worker delivers queued mail on its own and exits cleanly on SIGTERM", async () => {
    const to = uniqueEmail("worker");
    await db().transaction((tx) => queueMail(tx, [{ organizationId: crew.owner.organizationId, to, subject: "From the worker", text: "x", html: "<p>x</p>" }]));
    const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
      env: { ...process.env, ENGINE_WORKER_ENTRY: "source" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (out += d));
    const exited = new Promise<number | null>((r) => child.on("exit", (code) => r(code)));
    try {
      await waitForMail(to, /From the worker/, 30_000);
    } finally {
      child.kill("SIGTERM");
    }
    const t0 = Date.now();
    expect(await exited).toBe(0);
    expect(Date.now() - t0).toBeLessThan(15_000);
    expect(out).toContain("worker running");
    expect(out).toContain("job runner stopped");
    expect(QUEUES.mail.name).toBe("mail-delivery");
  });
});

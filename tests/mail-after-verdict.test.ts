/**
 * The leads' review e-mail after an upload never holds up a verdict (our rule): it is committed in
 * the outbox with the test and its delivery job, and a server busy with uploads holds that job
 * until no upload has been in progress for a moment (lib/jobs/local-load.ts), at the latest for
 * the longest wait, so under steady load mail still goes. Real database, pg-boss, S3 fake, catcher.
 */
import { afterEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { POST as uploadPost } from "@/app/api/vacuum-tests/route";
import { uploadInProgress } from "@/lib/jobs/local-load";
import { setMaxQuietWaitMsForTests } from "@/lib/jobs/runner";
import { crewForFile } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { waitForMail } from "./helpers/mailbox";
import { sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();
jobRunnerForFile();

async function uploadLeak(title: string): Promise<string> {
  const res = await uploadPost(uploadRequest("/api/vacuum-tests", { as: crew.technician, file: { body: sampleText("sample-2-elapsed-mtorr.csv"), name: "sample-2-elapsed-mtorr.csv" }, fields: { title } }));
  expect(res.status).toBe(201);
  return (await res.json()).test.id;
}

const statusOf = async (testId: string) => (await db().select({ status: mailOutbox.status }).from(mailOutbox).where(eq(mailOutbox.testId, testId))).map((r) => r.status);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

afterEach(() => setMaxQuietWaitMsForTests(null));

describe("review e-mail after an upload waits for the verdicts (our rule, lib/jobs/local-load.ts)", () => {
  it("stays queued while another upload is in progress, and goes once uploads stop", async () => {
    setMaxQuietWaitMsForTests(60_000);
    const busy = uploadInProgress(); // another technician's upload still running
    const id = await uploadLeak("Quiet-moment check, busy");
    await sleep(2500); // the job waits in the queue: a server serving uploads does not fetch it
    const queued = await statusOf(id);
    expect(queued.length).toBeGreaterThan(0); // committed with the test…
    expect(new Set(queued)).toEqual(new Set(["pending"])); // …and not sent yet
    busy();
    const mail = await waitForMail(crew.lead.email, /Review requested: Quiet-moment check, busy/);
    expect(mail.text).toContain(crew.technician.name);
    await expect.poll(async () => new Set(await statusOf(id)), { timeout: 5000 }).toEqual(new Set(["sent"]));
  });

  it("goes at the latest after the longest wait even if uploads never stop", async () => {
    setMaxQuietWaitMsForTests(700);
    const busy = uploadInProgress();
    try {
      const id = await uploadLeak("Quiet-moment check, steady load");
      await waitForMail(crew.lead.email, /Review requested: Quiet-moment check, steady load/, 8000);
      await expect.poll(async () => new Set(await statusOf(id)), { timeout: 5000 }).toEqual(new Set(["sent"]));
    } finally {
      busy();
    }
  });
});

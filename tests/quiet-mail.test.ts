/**
 * The leads' review e-mail after an upload waits for a quiet moment (lib/notify/when-quiet.ts,
 * our own rule): it is committed in the outbox with the test, sent once no upload has been in
 * progress for a short while, and at the latest after the longest wait even while uploads go on.
 * Real database, real S3 fake, real SMTP catcher.
 */
import { afterEach, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import { POST as uploadPost } from "@/app/api/tests/route";
import { setQuietMailTimingForTests, uploadInProgress } from "@/lib/notify/when-quiet";
import { crewForFile } from "./helpers/crew";
import { waitForMail } from "./helpers/mailbox";
import { sampleText, uploadRequest } from "./helpers/uploads";

const crew = crewForFile();

async function uploadLeak(title: string): Promise<string> {
  const res = await uploadPost(uploadRequest("/api/tests", { as: crew.technician, file: { body: sampleText("sample-2-elapsed-mtorr.csv"), name: "sample-2-elapsed-mtorr.csv" }, fields: { title } }));
  expect(res.status).toBe(201);
  return (await res.json()).test.id;
}

const statusOf = async (testId: string) => (await db().select({ status: mailOutbox.status }).from(mailOutbox).where(eq(mailOutbox.testId, testId))).map((r) => r.status);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

afterEach(() => setQuietMailTimingForTests(null));

describe("review e-mail after an upload waits for a quiet moment (our rule, lib/notify/when-quiet.ts)", () => {
  it("stays queued while another upload is in progress, and goes once uploads stop", async () => {
    setQuietMailTimingForTests({ quietMs: 100, maxWaitMs: 60_000 });
    const busy = uploadInProgress(); // another technician's upload still running
    const id = await uploadLeak("Quiet-moment check, busy");
    await sleep(500);
    const queued = await statusOf(id);
    expect(queued.length).toBeGreaterThan(0); // committed with the test…
    expect(new Set(queued)).toEqual(new Set(["pending"])); // …and not sent yet
    busy();
    const mail = await waitForMail(crew.lead.email, /Review requested: Quiet-moment check, busy/);
    expect(mail.text).toContain(crew.technician.name);
    await expect.poll(async () => new Set(await statusOf(id)), { timeout: 5000 }).toEqual(new Set(["sent"]));
  });

  it("goes at the latest after the longest wait even if uploads never stop", async () => {
    setQuietMailTimingForTests({ quietMs: 100, maxWaitMs: 700 });
    const busy = uploadInProgress();
    try {
      const id = await uploadLeak("Quiet-moment check, steady load");
      await waitForMail(crew.lead.email, /Review requested: Quiet-moment check, steady load/, 5000);
      await expect.poll(async () => new Set(await statusOf(id)), { timeout: 5000 }).toEqual(new Set(["sent"]));
    } finally {
      busy();
    }
  });
});

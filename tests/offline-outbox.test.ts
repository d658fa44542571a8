/**
 * The phone outbox's rules (lib/offline/rules.ts, lib/offline/drain.ts's request): back-off,
 * what each answer means, whose capture is sent, the Idempotency-Key kept across tries, and what
 * the phone says changed between its provisional verdict and the server's.
 */
import { describe, expect, it } from "vitest";
import { BACKOFF_MAX_MS, backoffMs, isDue, isUnsent, mayBeSentBy, nextTryAt, outcomeOf, retryAfterMs, whatChanged, type VerdictSummary } from "@/lib/offline/rules";
import { requestOf } from "@/lib/offline/drain";
import type { Capture } from "@/lib/offline/outbox";

const capture = (over: Partial<Capture> = {}): Capture => ({
  id: "c1",
  userId: "u-tess",
  idempotencyKey: "5b0f3c1e-7d2a-4a39-9f00-2f6d1c0e9a11",
  createdAt: 0,
  source: "typed",
  label: "Typed readings (3)",
  readings: [{ time: 0, microns: 400 }, { time: 1, microns: 420 }, { time: 2, microns: 430 }],
  timeMode: "minutes",
  fields: { notes: "basement unit", ambientC: 18 },
  status: "saved",
  attempts: 0,
  nextTryAt: 0,
  bytes: 40,
  ...over,
});

describe("outbox back-off (exponential with equal jitter; common practice, no published source)", () => {
  it("doubles from 2 s, never waits under half its step, and caps at 5 minutes", () => {
    expect([1, 2, 3, 4, 5].map((n) => backoffMs(n, () => 0))).toEqual([1000, 2000, 4000, 8000, 16000]);
    expect([1, 2, 3, 4, 5].map((n) => backoffMs(n, () => 0.999999))).toEqual([2000, 4000, 8000, 16000, 32000]);
    for (let n = 1; n < 100; n++) expect(backoffMs(n)).toBeLessThanOrEqual(BACKOFF_MAX_MS);
    expect(backoffMs(60, () => 0.5)).toBe(0.75 * BACKOFF_MAX_MS);
  });

  it("honours the server's Retry-After, in seconds or as a date, within the 5-minute cap (RFC 9110 §10.2.3)", () => {
    expect(retryAfterMs("7", 0)).toBe(7000);
    expect(retryAfterMs(new Date(30_000).toUTCString(), 0)).toBe(30_000);
    expect(retryAfterMs("soon", 0)).toBeNull();
    const o = outcomeOf(503, "down", 20_000);
    expect(nextTryAt(o, 1, 1000, () => 0)).toBe(21_000);
    expect(nextTryAt(outcomeOf(503, null, 3_600_000), 1, 0, () => 0)).toBe(BACKOFF_MAX_MS);
  });
});

describe("what an answer to a capture means (IETF draft-ietf-httpapi-idempotency-key-header)", () => {
  it("2xx is sent; no answer, 408, 429 and 5xx are retried; 409 (the key's earlier try still running) is retried with the same key", () => {
    expect(outcomeOf(201, null).kind).toBe("sent");
    expect(outcomeOf(202, null).kind).toBe("sent");
    for (const s of [0, 408, 429, 500, 502, 503, 504, 409]) expect(outcomeOf(s, null).kind).toBe("retry");
  });

  it("401 waits for sign-in; a 422 (unreadable log, or the key used for another request) fails with the server's reason and is not retried by itself", () => {
    expect(outcomeOf(401, null).kind).toBe("sign_in");
    const bad = outcomeOf(422, "Line 4: the time “xx” is not a time.");
    expect(bad).toEqual({ kind: "failed", reason: "Line 4: the time “xx” is not a time." });
    expect(nextTryAt(bad, 1, 0)).toBeNull();
    expect(outcomeOf(403, null).kind).toBe("failed");
  });

  it("every try of a capture is the same request with the key made at capture", async () => {
    const c = capture();
    const a = requestOf(c);
    const b = requestOf({ ...c, attempts: 5, status: "sending" });
    expect((a.headers as Record<string, string>)["idempotency-key"]).toBe(c.idempotencyKey);
    expect((b.headers as Record<string, string>)["idempotency-key"]).toBe(c.idempotencyKey);
    expect(a.body).toBe(b.body);
    expect(JSON.parse(String(a.body))).toEqual({ readings: c.readings, timeMode: "minutes", notes: "basement unit", ambientC: 18 });
    const f = capture({ source: "file", file: new Blob(["Time,Vacuum (microns)\n"]), fileName: "hold.csv", readings: undefined });
    const form = requestOf(f).body as FormData;
    expect((form.get("file") as File).name).toBe("hold.csv");
    expect(form.get("notes")).toBe("basement unit");
  });
});

describe("whose capture is sent", () => {
  it("only under the account that captured it, and only when due", () => {
    const c = capture({ nextTryAt: 5000 });
    expect(mayBeSentBy(c, "u-tess")).toBe(true);
    expect(mayBeSentBy(c, "u-other")).toBe(false);
    expect(mayBeSentBy(c, null)).toBe(false);
    expect(isDue(c, "u-tess", 4999)).toBe(false);
    expect(isDue(c, "u-tess", 5000)).toBe(true);
    expect(isDue(c, "u-other", 9999)).toBe(false);
    expect(isDue({ ...c, status: "failed" }, "u-tess", 9999)).toBe(false);
    expect(isDue({ ...c, status: "sending" }, "u-tess", 9999)).toBe(true); // a tab closed mid-send: tried again, same key
    expect(isUnsent({ status: "confirmed" })).toBe(false);
    expect(isUnsent({ status: "waiting_sign_in" })).toBe(true);
  });
});

describe("provisional against confirmed verdict", () => {
  const phone: VerdictSummary = { verdict: "pass", earlyCall: null, meetsProfile: true, leakRateMicronsPerMinute: 0.4, engineVersion: "0.2.0" };
  it("says nothing changed when they agree, and names every difference, an engine mismatch first", () => {
    expect(whatChanged(phone, { ...phone })).toEqual([]);
    const d = whatChanged(phone, { ...phone, verdict: "leak", engineVersion: "0.3.0", meetsProfile: false, leakRateMicronsPerMinute: 25 });
    expect(d[0]).toMatch(/Engine versions differ: this phone ran 0.2.0, Riseline ran 0.3.0/);
    expect(d.join(" ")).toMatch(/“pass” to “leak”/);
    expect(d.join(" ")).toMatch(/profile is not met/);
    expect(d.join(" ")).toMatch(/0.40 → 25.00/);
  });
});

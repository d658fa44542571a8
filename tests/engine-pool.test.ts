/**
 * The engine's worker pool gives the same answers as the engine on the request thread, brings
 * an unreadable log's LogError back intact, runs logs side by side, and survives a worker that
 * overruns. Real worker threads (run through tsx under vitest).
 */
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LogError } from "@/analysis/shared/errors";
import { AppError } from "@/lib/errors";
import { runAnalysis } from "@/lib/vacuum-tests/engine";
import { Worker } from "node:worker_threads";
import { runEngineTask } from "@/lib/engine/tasks";
import {
  analyseOffThread, runOnEngine, closeEnginePool, engineMode, setEngineTimeoutForTests, setInlineMaxKbForTests, setWorkerSpawnForTests,
} from "@/lib/engine/pool";

const golden = (name: string) => readFileSync(`fixtures/golden/${name}`, "utf8");

// The golden logs are small: send every one to the pool (the inline size has its own test below).
beforeAll(() => setInlineMaxKbForTests(0));

afterAll(async () => {
  setInlineMaxKbForTests(null);
  setEngineTimeoutForTests(null);
  setWorkerSpawnForTests(null);
  await closeEnginePool();
});

describe("engine worker pool", () => {
  it("returns exactly what the inline engine returns for the same log (our own contract)", async () => {
    const text = golden("layout-iso-pa.csv");
    const inline = runAnalysis(text, {});
    const pooled = await analyseOffThread(text, {});
    expect(pooled.result.verdict).toBe(inline.result.verdict);
    expect(pooled).toEqual(inline);
    expect(engineMode()).toBe("workers");
  });

  it("brings back the importer's LogError with its code and line (our own contract)", async () => {
    const text = "time,microns\n0,500\n1,abc\n";
    let inlineErr: unknown;
    try {
      runAnalysis(text, {});
    } catch (e) {
      inlineErr = e;
    }
    expect(inlineErr).toBeInstanceOf(LogError);
    const err = await analyseOffThread(text, {}).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(LogError);
    expect((err as LogError).code).toBe((inlineErr as LogError).code);
    expect((err as LogError).message).toBe((inlineErr as LogError).message);
    expect((err as LogError).line).toBe((inlineErr as LogError).line);
  });

  it("analyses several logs at once, each getting its own answer (our own contract)", async () => {
    const names = ["layout-iso-pa.csv", "layout-tab-mtorr.csv", "layout-datetime-mbar.csv", "scenario-frozen_moisture.csv", "layout-elapsed_s-psia.csv"];
    const runs = await Promise.all(names.map((n) => analyseOffThread(golden(n), {})));
    names.forEach((n, i) => expect(runs[i].result).toEqual(runAnalysis(golden(n), {}).result));
  });

  it("fails only the overrunning log with a clear 503 and keeps serving (our own contract)", async () => {
    // A worker that loads but never answers: the timeout, not the machine's speed, decides.
    await closeEnginePool();
    setWorkerSpawnForTests(() => new Worker("require('node:worker_threads').parentPort.postMessage({ ready: true }); setInterval(() => {}, 1000);", { eval: true }));
    setEngineTimeoutForTests(300);
    try {
      const err = await analyseOffThread(golden("layout-iso-pa.csv"), {}).catch((e: unknown) => e);
      expect(err).toBeInstanceOf(AppError);
      expect((err as AppError).status).toBe(503);
    } finally {
      setWorkerSpawnForTests(null);
      setEngineTimeoutForTests(null);
      await closeEnginePool();
    }
    const after = await analyseOffThread(golden("layout-iso-pa.csv"), {});
    expect(after.result.verdict).toBe(runAnalysis(golden("layout-iso-pa.csv"), {}).result.verdict);
  });

  it("analyses inline when workers cannot be started at all, instead of failing the upload (our own contract)", async () => {
    await closeEnginePool();
    setWorkerSpawnForTests(() => {
      throw new Error("no worker threads here");
    });
    try {
      const text = golden("layout-tab-mtorr.csv");
      const run = await analyseOffThread(text, {});
      expect(run.result).toEqual(runAnalysis(text, {}).result);
      expect(engineMode()).toBe("inline");
    } finally {
      setWorkerSpawnForTests(null);
      await closeEnginePool();
    }
  });

  it("analyses inline a log whose worker's entry never loaded (our own contract)", async () => {
    await closeEnginePool();
    setWorkerSpawnForTests(() => new Worker("throw new Error('broken entry')", { eval: true }));
    try {
      const text = golden("layout-datetime-mbar.csv");
      const runs = await Promise.all([analyseOffThread(text, {}), analyseOffThread(text, {}), analyseOffThread(text, {})]);
      for (const run of runs) expect(run.result).toEqual(runAnalysis(text, {}).result);
    } finally {
      setWorkerSpawnForTests(null);
      await closeEnginePool();
    }
  });

  it("runs every kind of log the server reads through the same door: preview, blank-off and nitrogen logs answer on a worker as inline (our own contract)", async () => {
    await closeEnginePool();
    let spawned = 0;
    setWorkerSpawnForTests(() => {
      spawned++;
      return new Worker(`require("tsx/cjs"); require(${JSON.stringify(`${process.cwd()}/lib/engine/worker.ts`)});`, { eval: true });
    });
    try {
      const text = golden("layout-datetime-mbar.csv");
      const csvText = "time,pressure psia,temp °F\n2026-05-01 08:00:00,314.696,80\n2026-05-01 09:00:00,311.5,75\n2026-05-01 10:00:00,308.865,70\n";
      const tasks = [
        { kind: "preview", text, options: {} },
        { kind: "blank-off", text },
        { kind: "nitrogen", body: { source: "file", csvText, temperatureUnit: "F", ratedTestPressureGauge: 450 } },
      ] as const;
      for (const task of tasks) expect(await runOnEngine(task as never)).toEqual(runEngineTask(task as never));
      expect(spawned).toBeGreaterThan(0);
      expect(engineMode()).toBe("workers");
      const bad = await runOnEngine({ kind: "blank-off", text: readFileSync("fixtures/bad/no-pressure-column.csv", "utf8") }).catch((e: unknown) => e);
      expect(bad).toBeInstanceOf(LogError);
      const unusable = await runOnEngine({ kind: "nitrogen", body: { source: "typed", unit: "psig", temperatureUnit: "F", start: { pressureGauge: 300, temperature: 70 }, end: { pressureGauge: 300, temperature: 70 }, durationMinutes: 10, readings: [{ minutes: 20, pressureGauge: 300 }] } as never }).catch((e: unknown) => e);
      expect(unusable).toBeInstanceOf(RangeError);
    } finally {
      setWorkerSpawnForTests(null);
      await closeEnginePool();
    }
  });

  it("lets a script exit by itself once its analyses are done: idle workers hold nothing open (our own contract)", () => {
    // The timeout is a hang guard, not a speed target: a pool that kept the process alive would be killed by it.
    const child = spawnSync(process.execPath, ["--import", "tsx", "tests/helpers/pool-exit.ts"], {
      env: { ...process.env, ENGINE_WORKER_ENTRY: "source", ENGINE_WORKERS: "2", ENGINE_INLINE_MAX_KB: "0" },
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(child.signal).toBeNull();
    expect(child.status).toBe(0);
    expect(child.stdout).toContain(`verdict=${runAnalysis(golden("layout-iso-pa.csv"), {}).result.verdict}`);
  });

  it("analyses a log up to the inline size on the calling thread and a larger one on a worker (our own contract)", async () => {
    await closeEnginePool();
    let spawned = 0;
    setWorkerSpawnForTests(() => {
      spawned++;
      return new Worker(`require("tsx/cjs"); require(${JSON.stringify(`${process.cwd()}/lib/engine/worker.ts`)});`, { eval: true });
    });
    const small = golden("layout-iso-pa.csv");
    const large = golden("layout-datetime-mbar.csv"); // 15 kB against a 6 kB inline size
    setInlineMaxKbForTests(Math.ceil(small.length / 1024));
    try {
      expect(large.length).toBeGreaterThan(Math.ceil(small.length / 1024) * 1024);
      expect((await analyseOffThread(small, {})).result).toEqual(runAnalysis(small, {}).result);
      expect(spawned).toBe(0);
      expect(engineMode()).toBe("not started");
      expect((await analyseOffThread(large, {})).result).toEqual(runAnalysis(large, {}).result);
      expect(spawned).toBeGreaterThan(0);
      expect(engineMode()).toBe("workers");
    } finally {
      setInlineMaxKbForTests(0);
      setWorkerSpawnForTests(null);
      await closeEnginePool();
    }
  });
});

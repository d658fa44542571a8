/**
 * `npm run demo` supervises the app server (scripts/lib.sh `supervise`): when it dies it is started
 * again with a message and back-off, the other services left running; TERM or Ctrl-C stops
 * everything and leaves no process behind. (Common practice for a process supervisor, no
 * published source; the back-off doubles from 1 s to at most 30 s.)
 */
import { spawn, execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "..");

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** Every process whose parent is `pid`, and theirs, from ps. */
function descendants(pid: number): number[] {
  const rows = execFileSync("ps", ["-eo", "pid=,ppid="], { encoding: "utf8" })
    .trim()
    .split("\n")
    .map((l) => l.trim().split(/\s+/).map(Number));
  const out: number[] = [];
  const walk = (p: number) => rows.filter(([, pp]) => pp === p).forEach(([c]) => (out.push(c), walk(c)));
  walk(pid);
  return out;
}

function runSupervisor(appScript: string) {
  const dir = mkdtempSync(path.join(tmpdir(), "rl-supervise-"));
  const pidFile = path.join(dir, "app.pid");
  const log = path.join(dir, "app.log");
  const app = path.join(dir, "app.mjs");
  writeFileSync(app, appScript);
  const script = `set -euo pipefail
. scripts/lib.sh
trap 'stop_supervised "${pidFile}"' EXIT
trap 'SUPERVISING=0; exit 130' INT TERM
supervise "The test app" "${pidFile}" "${log}" -- node "${app}"`;
  const child = spawn("bash", ["-c", script], { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  child.stdout.on("data", (d) => (out += d));
  child.stderr.on("data", (d) => (out += d));
  const exited = new Promise<number | null>((resolve) => child.on("exit", (code, signal) => resolve(code ?? (signal ? 128 : null))));
  return { child, pidFile, log, output: () => out, exited, appPids: () => {
      try {
        return [...readFileSync(log, "utf8").matchAll(/up (\d+)/g)].map((m) => Number(m[1]));
      } catch {
        return []; // not started yet
      }
    } };
}

async function until(check: () => boolean, ms: number) {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error("timed out");
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe("the demo's app supervisor", () => {
  it("restarts a dying app with a message and doubling back-off, then TERM stops it all", async () => {
    const s = runSupervisor(`console.log("up", process.pid); setTimeout(() => process.exit(3), 200);`);
    await until(() => /starting it again in 2 s/.test(s.output()), 15_000);
    expect(s.output()).toMatch(/The test app stopped \(exit 3\) .*starting it again in 1 s\. The other services keep running/);
    expect(s.appPids().length).toBeGreaterThanOrEqual(2);
    const family = descendants(s.child.pid!);
    s.child.kill("SIGTERM");
    expect(await s.exited).toBe(130);
    await until(() => [...family, ...s.appPids()].every((p) => !alive(p)), 5000);
  });

  it("stops a running app's whole process group on TERM (nothing left behind)", async () => {
    // The app starts a grandchild of its own, as `next start` starts its workers.
    const s = runSupervisor(`import { spawn } from "node:child_process";
const kid = spawn(process.execPath, ["-e", "setInterval(() => {}, 1000)"], { stdio: "ignore" });
console.log("up", process.pid); console.log("up", kid.pid); setInterval(() => {}, 1000);`);
    await until(() => s.appPids().length >= 2, 10_000);
    const pids = s.appPids();
    expect(pids.every(alive)).toBe(true);
    s.child.kill("SIGTERM");
    expect(await s.exited).toBe(130);
    await until(() => pids.every((p) => !alive(p)), 8000);
    expect(s.output()).not.toMatch(/starting it again/);
  });
});

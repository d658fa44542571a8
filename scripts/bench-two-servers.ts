/**
 * The two-server part of `npm run bench:api`: a second `next start` on the next port, over the
 * same PostgreSQL, S3 fake and catcher (both servers run the background jobs), warmed like the
 * first, then the same rounds of concurrent uploads split between the two. Started only after
 * the one-server figures, so it takes no mail job from them; stopped at the end. This machine
 * has 2 cores, so a second server shares them rather than adding any: the figure shows the
 * servers working side by side, not more capacity.
 */
import { spawn } from "node:child_process";

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

export async function twoServerRounds(o: {
  base: string;
  cookie: string;
  warm: (server: string) => Promise<void>;
  round: (servers: string[]) => Promise<number[]>;
  rounds: number;
  waitForMail: (lastVerdictAt: number) => Promise<{ rows: number; ms: number }>;
}): Promise<{ p50: number; p95: number; mailMs: number }> {
  const first = new URL(o.base);
  const second = `http://${first.hostname}:${Number(first.port) + 1}`;
  // The same settings as the first server, but its own address for links and origin checks.
  const proc = spawn(process.execPath, ["./node_modules/next/dist/bin/next", "start", "-H", first.hostname, "-p", String(Number(first.port) + 1)], {
    env: { ...process.env, BETTER_AUTH_URL: second, TRUSTED_ORIGINS: o.base },
    detached: true,
    stdio: "ignore",
  });
  try {
    const deadline = Date.now() + 90_000;
    while (!(await fetch(`${second}/api/health`).then((r) => r.ok, () => false))) {
      if (Date.now() > deadline || proc.exitCode !== null) throw new Error("the second server did not start");
      await new Promise((r) => setTimeout(r, 250));
    }
    await o.warm(second);
    const all: number[] = [];
    for (let r = 0; r < o.rounds; r++) all.push(...(await o.round([o.base, second])));
    const mail = await o.waitForMail(performance.now());
    const s = all.sort((a, b) => a - b);
    return { p50: percentile(s, 50), p95: percentile(s, 95), mailMs: mail.ms };
  } finally {
    const exited = new Promise((r) => (proc.exitCode !== null ? r(null) : proc.once("exit", r)));
    try {
      process.kill(-proc.pid!, "SIGTERM");
    } catch {
      /* already gone */
    }
    await Promise.race([exited, new Promise((r) => setTimeout(r, 25_000))]);
  }
}

/**
 * The parts of the two-server test: `next start` servers over the test profile's PostgreSQL and S3
 * fake (each a process group of its own, so it can be killed outright), an SMTP catcher in this
 * process that can be taken down and brought back, and a keep-alive HTTP client.
 */
import { spawn, type ChildProcess } from "node:child_process";
import http from "node:http";
import { gunzipSync } from "node:zlib";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { env } from "@/lib/env";

/** The test profile's app port (from BETTER_AUTH_URL); the servers take the next ones. */
export function basePort(): number {
  return Number(new URL(env().BETTER_AUTH_URL).port);
}

export interface Server {
  name: string;
  url: string;
  proc: ChildProcess;
  log: string[];
  agent: http.Agent;
}

export function serverUrls(count: number): string[] {
  return Array.from({ length: count }, (_, i) => `http://127.0.0.1:${basePort() + 1 + i}`);
}

/** Start `next start` on a port with the cluster's settings; resolves when /api/health answers 200. */
export async function startServer(name: string, url: string, extraEnv: Record<string, string>): Promise<Server> {
  const port = new URL(url).port;
  const proc = spawn(process.execPath, ["./node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", port], {
    env: { ...process.env, ...extraEnv, BETTER_AUTH_URL: url, NEXT_TELEMETRY_DISABLED: "1" },
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const log: string[] = [];
  const keep = (d: Buffer) => {
    log.push(...d.toString().split("\n").filter(Boolean));
    if (log.length > 400) log.splice(0, log.length - 400);
  };
  proc.stdout!.on("data", keep);
  proc.stderr!.on("data", keep);
  const server: Server = { name, url, proc, log, agent: new http.Agent({ keepAlive: true, maxSockets: 32 }) };
  const deadline = Date.now() + 90_000;
  for (;;) {
    if (proc.exitCode !== null) throw new Error(`${name} exited at start:\n${log.slice(-30).join("\n")}`);
    const ok = await fetch(`${url}/api/health`).then((r) => r.ok, () => false);
    if (ok) return server;
    if (Date.now() > deadline) throw new Error(`${name} did not start:\n${log.slice(-30).join("\n")}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Kill a server's whole process group at once (SIGKILL: no shutdown of any kind), or stop it (SIGTERM). */
export async function stopServer(s: Server, signal: "SIGKILL" | "SIGTERM"): Promise<void> {
  s.agent.destroy();
  if (s.proc.exitCode !== null || s.proc.signalCode !== null) return;
  const exited = new Promise((r) => s.proc.once("exit", r));
  try {
    process.kill(-s.proc.pid!, signal);
  } catch {
    return;
  }
  await Promise.race([exited, new Promise((r) => setTimeout(r, 30_000))]);
}

export interface Caught {
  messageId: string;
  to: string[];
  subject: string;
  at: number;
}

/** An SMTP catcher on a fixed port that can go down and come back (the messages it caught stay). */
export class Catcher {
  readonly messages: Caught[] = [];
  private server: SMTPServer | null = null;
  constructor(readonly port: number) {}

  async up(): Promise<void> {
    const server = new SMTPServer({
      authOptional: true,
      disableReverseLookup: true,
      disabledCommands: ["STARTTLS"],
      logger: false,
      onData: (stream, session, cb) => {
        simpleParser(stream)
          .then((m) => {
            this.messages.push({ messageId: m.messageId ?? "", to: session.envelope.rcptTo.map((r) => r.address), subject: m.subject ?? "", at: Date.now() });
            cb();
          })
          .catch(cb);
      },
    });
    await new Promise<void>((resolve, reject) => {
      server.once("error", reject);
      server.listen(this.port, "127.0.0.1", () => resolve());
    });
    this.server = server;
  }

  /** Down: no new connections, and open ones cut. */
  async down(): Promise<void> {
    const s = this.server;
    this.server = null;
    if (!s) return;
    for (const c of (s as unknown as { connections?: Set<{ close: () => void }> }).connections ?? []) c.close();
    await new Promise<void>((r) => s.close(() => r()));
  }
}

export interface Answer {
  status: number;
  json: Record<string, unknown>;
  ms: number;
}

/** One request through a server's keep-alive agent; rejects on a connection failure. */
export function request(s: Server, path: string, init: { method?: string; headers?: Record<string, string>; body?: Buffer }): Promise<Answer> {
  const t0 = performance.now();
  return new Promise((resolve, reject) => {
    const req = http.request(new URL(path, s.url), { method: init.method ?? "GET", agent: s.agent, headers: { origin: s.url, "accept-encoding": "gzip", ...init.headers } }, (res) => {
      const parts: Buffer[] = [];
      res.on("data", (c: Buffer) => parts.push(c));
      res.on("error", reject);
      res.on("end", () => {
        const raw = Buffer.concat(parts);
        const text = (res.headers["content-encoding"] === "gzip" ? gunzipSync(raw) : raw).toString("utf8");
        let json: Record<string, unknown> = {};
        try {
          json = text ? JSON.parse(text) : {};
        } catch {
          json = { text };
        }
        resolve({ status: res.statusCode ?? 0, json, ms: performance.now() - t0 });
      });
    });
    req.setTimeout(60_000, () => req.destroy(new Error("timed out")));
    req.on("error", reject);
    req.end(init.body);
  });
}

/** A multipart upload body for one log with a title. */
export async function uploadBody(text: string, title: string): Promise<{ body: Buffer; contentType: string }> {
  const form = new FormData();
  form.set("file", new File([text], "cluster.csv", { type: "text/csv" }));
  form.set("title", title);
  const encoded = new Response(form);
  return { contentType: encoded.headers.get("content-type")!, body: Buffer.from(await encoded.arrayBuffer()) };
}

export function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

import { z } from "zod";
import { DATABASE_SETTINGS } from "@/db/settings";

/**
 * The only reader of process.env. Every key is documented in .env.example.
 * Parsed once, lazily, so importing a module never fails at build time.
 */
const schema = z.object({
  RISELINE_MODE: z.enum(["development", "demo", "test", "production"]).default("development"),
  ...DATABASE_SETTINGS.shape,
  BETTER_AUTH_SECRET: z.string().min(32, "BETTER_AUTH_SECRET must be at least 32 characters"),
  BETTER_AUTH_URL: z.string().url().default("http://127.0.0.1:3000"),
  /** Comma-separated extra origins trusted for auth POSTs (e.g. http://localhost:3000). */
  TRUSTED_ORIGINS: z.string().default(""),
  /** "on" or "off"; defaults to on in production, off elsewhere. */
  AUTH_RATE_LIMIT: z.enum(["on", "off"]).optional(),
  S3_ENDPOINT: z.string().url(),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().positive().default(2525),
  MAIL_FROM: z.string().default("Riseline <no-reply@riseline.test>"),
  /** Folder where the local SMTP catcher stores messages (demo/development/test only). */
  MAILBOX_DIR: z.string().optional(),
  /** Upload limit in bytes for a gauge log. */
  MAX_UPLOAD_BYTES: z.coerce.number().int().positive().default(32 * 1024 * 1024),
  /** Engine worker threads (lib/engine/pool.ts); 0 analyses on the request thread; unset = one per core less one (at least 1, at most 4). */
  ENGINE_WORKERS: z.coerce.number().int().min(0).max(16).optional(),
  /**
   * Logs up to this size (kB) are analysed on the request thread, larger ones in a worker: handing
   * a log to a worker costs more than analysing a small one (lib/engine/pool.ts). 0: always a worker.
   */
  ENGINE_INLINE_MAX_KB: z.coerce.number().int().min(0).default(256),
  /** Longest one analysis may run in a worker before that worker is replaced and the upload fails cleanly. */
  ENGINE_TIMEOUT_MS: z.coerce.number().int().positive().default(60_000),
  /** Largest JSON request body accepted, bytes (413 above it). Typed readings (20,000 at most) fit in well under 1 MiB. */
  MAX_JSON_BYTES: z.coerce.number().int().positive().default(1024 * 1024),
  /**
   * Addresses (IPs or CIDR ranges, comma-separated) of the reverse proxies in front of the app whose
   * X-Forwarded-For is believed. Empty (the default): X-Forwarded-For is ignored and the client is the
   * TCP peer, so a client cannot pick its own rate-limit bucket.
   */
  TRUSTED_PROXIES: z.string().default(""),
  /** S3: longest wait to connect, and longest silence on an open request (ms). */
  S3_CONNECT_TIMEOUT_MS: z.coerce.number().int().positive().default(3000),
  S3_REQUEST_TIMEOUT_MS: z.coerce.number().int().positive().default(15_000),
  /** SMTP: longest wait to connect and for the greeting, and longest silence on a connection (ms). */
  SMTP_CONNECT_TIMEOUT_MS: z.coerce.number().int().positive().default(5000),
  SMTP_SOCKET_TIMEOUT_MS: z.coerce.number().int().positive().default(15_000),
  /** "bundled": the worker entry Next.js built; "source": lib/engine/worker.ts through tsx (vitest, scripts). */
  ENGINE_WORKER_ENTRY: z.enum(["bundled", "source"]).default("bundled"),
  /** PostgreSQL schema of the job queue (pg-boss creates and migrates it itself; lib/jobs/boss.ts). */
  JOBS_SCHEMA: z.string().regex(/^[a-z_][a-z0-9_]{0,49}$/, "a lower-case PostgreSQL name").default("pgboss"),
  /** "on": `next start` also runs the background jobs (lib/jobs/runner.ts); "off" where `npm run worker` runs them instead. */
  JOBS_IN_APP: z.enum(["on", "off"]).default("on"),
  /** A raw file no committed test references is deleted once it is this old (the sweeper, lib/jobs/raw-sweep.ts). */
  RAW_SWEEP_SAFE_AGE_SECONDS: z.coerce.number().int().min(1).default(1800),
  /** Logs larger than this (kB) are analysed as a queued job the page follows; smaller ones answer with the verdict at once. */
  ANALYSIS_JOB_MIN_KB: z.coerce.number().int().min(1).default(1024),
  /** When the rig upkeep reminders go out (cron, UTC). */
  RIG_REMINDER_CRON: z.string().default("0 12 * * *"),
});

export type Env = z.infer<typeof schema>;

let cached: Env | null = null;

export function env(): Env {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const keys = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Riseline configuration is incomplete (${keys}). See .env.example.`);
  }
  cached = parsed.data;
  return cached;
}

/** True where the catcher's mailbox page and other helpers for trying the product may show. */
export function isLocalMode(): boolean {
  return env().RISELINE_MODE !== "production";
}

/** The mode and the Node environment only, for code that runs before the full configuration is needed (the proxy). */
export function runtimeMode(): { mode: Env["RISELINE_MODE"]; nodeEnv: string } {
  const mode = schema.shape.RISELINE_MODE.safeParse(process.env.RISELINE_MODE);
  return { mode: mode.success ? mode.data : "development", nodeEnv: process.env.NODE_ENV ?? "development" };
}

export function authRateLimitEnabled(): boolean {
  const e = env();
  return e.AUTH_RATE_LIMIT ? e.AUTH_RATE_LIMIT === "on" : e.RISELINE_MODE === "production";
}

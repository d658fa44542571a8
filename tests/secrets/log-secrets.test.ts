/**
 * No secret in any log line of the suite: OWASP ASVS 4.0.3 V7.1.1 (no credentials or payment
 * details in logs; session tokens only as irreversible hashes) and V7.1.2 (no other sensitive data).
 * Run after a suite, against its database and logs (LOG_SECRETS_FILES, comma-separated): every
 * session token and password hash in the database, every reset and verification token, every
 * token-bearing link the catcher received (reset, share, invitation key), and the suite's own
 * passwords — none may appear in the server logs or the test output.
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { DEMO_PEOPLE } from "@/scripts/demo-people";
import { PASSWORD } from "../helpers/members";
import { readMailbox } from "../helpers/mailbox";

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
});

const files = (process.env.LOG_SECRETS_FILES ?? "").split(",").map((f) => f.trim()).filter((f) => f && existsSync(f));

/** The suite's own passwords, as written in its sources. */
function suitePasswords(): string[] {
  const found = new Set<string>([PASSWORD, ...DEMO_PEOPLE.map((p) => p.password)]);
  const dir = path.resolve(import.meta.dirname, "..");
  const walk = (d: string): string[] => readdirSync(d, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(path.join(d, e.name)) : e.name.endsWith(".ts") ? [path.join(d, e.name)] : []));
  for (const f of walk(dir)) for (const m of readFileSync(f, "utf8").matchAll(/[Pp]assword\w*\s*=\s*"([^"]{10,})"/g)) found.add(m[1]);
  return [...found];
}

async function databaseSecrets(): Promise<{ kind: string; value: string }[]> {
  const out: { kind: string; value: string }[] = [];
  const sessions = await db().execute<{ token: string }>(sql`select token from "session"`);
  for (const r of sessions.rows) out.push({ kind: "session token", value: r.token });
  const accounts = await db().execute<{ password: string | null }>(sql`select password from account where password is not null`);
  for (const r of accounts.rows) out.push({ kind: "password hash", value: r.password! });
  const verifications = await db().execute<{ identifier: string; value: string }>(sql`select identifier, value from verification`);
  for (const r of verifications.rows) {
    const token = r.identifier.split(":").pop()!;
    if (token.length >= 16) out.push({ kind: "reset/verification token", value: token });
  }
  return out;
}

function mailedTokens(): { kind: string; value: string }[] {
  const out: { kind: string; value: string }[] = [];
  for (const m of readMailbox()) {
    for (const link of m.text.matchAll(/https?:\/\/\S+/g)) {
      const url = new URL(link[0].replace(/[).,]+$/, ""));
      for (const p of ["token", "key"]) {
        const v = url.searchParams.get(p);
        if (v && v.length >= 16) out.push({ kind: `mailed ${p}`, value: v });
      }
      const share = /\/(?:share|reset-password)\/([A-Za-z0-9_-]{16,})/.exec(url.pathname);
      if (share) out.push({ kind: "mailed link token", value: share[1] });
    }
  }
  return out;
}

describe("secrets in the suite's logs (OWASP ASVS 4.0.3 V7.1.1, V7.1.2)", () => {
  it("has logs to read", () => {
    expect(files.length, `LOG_SECRETS_FILES=${process.env.LOG_SECRETS_FILES}`).toBeGreaterThan(0);
  });

  it("finds no session token, password, password hash, reset token or mailed link token in any log line", async () => {
    const secrets = [...(await databaseSecrets()), ...mailedTokens(), ...suitePasswords().map((value) => ({ kind: "password", value }))];
    expect(secrets.filter((s) => s.kind === "session token").length).toBeGreaterThan(0);
    const hits: string[] = [];
    for (const file of files) {
      const text = readFileSync(file, "utf8");
      for (const s of secrets) {
        const at = text.indexOf(s.value);
        if (at >= 0) hits.push(`${path.basename(file)}: a ${s.kind} at line ${text.slice(0, at).split("\n").length}`);
      }
    }
    console.log(`checked ${secrets.length} secrets against ${files.length} logs (${files.map((f) => path.basename(f)).join(", ")})`);
    expect(hits).toEqual([]);
  });
});

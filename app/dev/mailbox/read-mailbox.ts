import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";

/** One message as the local SMTP catcher (scripts/fakes.mjs) stores it. */
export interface CaughtMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

/** Every caught message, newest first; unreadable files are skipped. */
export function readCaughtMessages(dir: string | undefined): CaughtMessage[] {
  if (!dir || !existsSync(dir)) return [];
  const out: CaughtMessage[] = [];
  for (const f of readdirSync(dir)) {
    if (!f.endsWith(".json")) continue;
    try {
      const m = JSON.parse(readFileSync(join(dir, f), "utf8")) as Partial<CaughtMessage>;
      out.push({ id: String(m.id ?? f.replace(/\.json$/, "")), receivedAt: String(m.receivedAt ?? ""), from: String(m.from ?? ""), to: Array.isArray(m.to) ? m.to.map(String) : [], subject: String(m.subject ?? "(no subject)"), text: String(m.text ?? ""), html: String(m.html ?? "") });
    } catch {
      /* a half-written file: it shows on the next load */
    }
  }
  return out.sort((a, b) => (a.receivedAt < b.receivedAt ? 1 : a.receivedAt > b.receivedAt ? -1 : 0));
}

/** Splits text into plain parts and http(s) links, so links render as <a>. */
export function splitLinks(text: string): Array<{ text: string; href?: string }> {
  const parts: Array<{ text: string; href?: string }> = [];
  const re = /https?:\/\/[^\s<>"')]+/g;
  let last = 0;
  for (const m of text.matchAll(re)) {
    if (m.index! > last) parts.push({ text: text.slice(last, m.index) });
    parts.push({ text: m[0], href: m[0] });
    last = m.index! + m[0].length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}

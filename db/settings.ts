import { z } from "zod";

/**
 * The data layer's own settings, read from process.env once. lib/env.ts includes this shape in
 * the whole configuration (one definition of each key; every key is documented in .env.example),
 * so the data layer never reaches up into lib/.
 */
export const DATABASE_SETTINGS = z.object({
  DATABASE_URL: z.string().url(),
  /** PostgreSQL: longest wait for a pooled connection, and longest one statement may run (ms). */
  PG_CONNECT_TIMEOUT_MS: z.coerce.number().int().positive().default(3000),
  PG_STATEMENT_TIMEOUT_MS: z.coerce.number().int().positive().default(15_000),
});

export type DatabaseSettings = z.infer<typeof DATABASE_SETTINGS>;

let cached: DatabaseSettings | null = null;

export function databaseSettings(): DatabaseSettings {
  if (cached) return cached;
  const parsed = DATABASE_SETTINGS.safeParse(process.env);
  if (!parsed.success) {
    const keys = parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join("; ");
    throw new Error(`Riseline configuration is incomplete (${keys}). See .env.example.`);
  }
  cached = parsed.data;
  return cached;
}

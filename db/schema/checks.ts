import { sql } from "drizzle-orm";
import { check, type AnyPgColumn } from "drizzle-orm/pg-core";

/**
 * A CHECK constraint that keeps a text column to one of a declared list of words (a NULL passes,
 * as SQL's IN does; NOT NULL is the column's own business). The lists come from db/vocabulary.ts and
 * the schema files, so the database, the server and the client agree on one vocabulary.
 */
export function oneOf(name: string, column: AnyPgColumn, values: readonly string[]) {
  for (const v of values) if (!/^[a-z0-9_]+$/i.test(v)) throw new Error(`oneOf(${name}): "${v}" is not a plain word`);
  return check(name, sql`${column} IN (${sql.raw(values.map((v) => `'${v}'`).join(", "))})`);
}

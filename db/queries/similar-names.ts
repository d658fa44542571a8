/**
 * Names like the one about to be created, so a technician typing "Harbour Dental" is shown
 * "Harbor Lane Dental — main office" before a second site is made beside it.
 *
 * Method: pg_trgm trigram matching (PostgreSQL documentation, F.35 pg_trgm). The score is the
 * larger of `similarity(a, b)` (shared trigrams over all trigrams of both) and
 * `word_similarity(typed, stored)` (the best match of the typed text within a stretch of the
 * stored name), both on lower-cased text, from 0 (nothing shared) to 1. A name scores at least
 * SIMILAR_NAME_MIN_SCORE to be shown (our choice, common practice for trigram matching, no
 * published source: 0.4 keeps "Harbour Dental" ~ "Harbor Lane Dental — main office" at 0.55 and
 * leaves unrelated names out). Scoped to the organization inside the query.
 */
import { and, eq, sql } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { Db } from "@/db/client";
import { customers, sites, systems } from "@/db/schema";

export const SIMILAR_NAME_MIN_SCORE = 0.4;
export type RecordKind = "customer" | "site" | "system";

export interface SimilarName {
  id: string;
  name: string;
  /** Where it belongs, in words: a site's customer, a system's site. */
  detail: string | null;
  score: number;
}

const scoreOf = (column: AnyPgColumn, typed: string) =>
  sql<number>`greatest(similarity(lower(${column}), lower(${typed})), word_similarity(lower(${typed}), lower(${column})))`;

export async function listSimilarNamesByOrganization(
  db: Db,
  params: { organizationId: string; kind: RecordKind; name: string; siteId?: string | null; limit?: number },
): Promise<SimilarName[]> {
  const typed = params.name.trim();
  if (typed.length < 3) return [];
  const limit = params.limit ?? 5;
  if (params.kind === "customer") {
    const score = scoreOf(customers.name, typed);
    return db
      .select({ id: customers.id, name: customers.name, detail: sql<string | null>`null`, score })
      .from(customers)
      .where(and(eq(customers.organizationId, params.organizationId), sql`${score} >= ${SIMILAR_NAME_MIN_SCORE}`))
      .orderBy(sql`${score} desc`, customers.name)
      .limit(limit);
  }
  if (params.kind === "site") {
    const score = scoreOf(sites.name, typed);
    return db
      .select({ id: sites.id, name: sites.name, detail: sql<string | null>`concat_ws(' · ', ${customers.name}, ${sites.address})`, score })
      .from(sites)
      .leftJoin(customers, and(eq(customers.id, sites.customerId), eq(customers.organizationId, sites.organizationId)))
      .where(and(eq(sites.organizationId, params.organizationId), sql`${score} >= ${SIMILAR_NAME_MIN_SCORE}`))
      .orderBy(sql`${score} desc`, sites.name)
      .limit(limit);
  }
  const score = scoreOf(systems.name, typed);
  return db
    .select({ id: systems.id, name: systems.name, detail: sites.name, score })
    .from(systems)
    .innerJoin(sites, and(eq(sites.id, systems.siteId), eq(sites.organizationId, systems.organizationId)))
    .where(
      and(
        eq(systems.organizationId, params.organizationId),
        params.siteId ? eq(systems.siteId, params.siteId) : undefined,
        sql`${score} >= ${SIMILAR_NAME_MIN_SCORE}`,
      ),
    )
    .orderBy(sql`${score} desc`, systems.name)
    .limit(limit);
}

import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { testComments, user } from "@/db/schema";

export async function insertTestComment(
  db: Db,
  params: { organizationId: string; testId: string; authorId: string; body: string; atSeconds: number | null },
) {
  const [row] = await db.insert(testComments).values(params).returning();
  return row;
}

/** A test's comments, oldest first, with the author's name. */
export async function listTestCommentsByTest(db: Db, params: { organizationId: string; testId: string }) {
  return db
    .select({
      id: testComments.id,
      body: testComments.body,
      atSeconds: testComments.atSeconds,
      createdAt: testComments.createdAt,
      authorId: testComments.authorId,
      authorName: user.name,
    })
    .from(testComments)
    .innerJoin(user, eq(user.id, testComments.authorId))
    .where(and(eq(testComments.organizationId, params.organizationId), eq(testComments.testId, params.testId)))
    .orderBy(asc(testComments.createdAt), asc(testComments.id));
}

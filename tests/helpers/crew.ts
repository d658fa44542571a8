/**
 * Shared setup of the API test files: one shop with a member of every role, made once before the
 * file's tests, and the database pool closed after them; plus the JSON request init they all send.
 */
import { afterAll, beforeAll } from "vitest";
import type { Role } from "@/lib/permissions";
import { createCrew, type TestMember } from "./members";

/** Registers beforeAll/afterAll; the returned crew is filled in before the first test runs. */
export function crewForFile(): Record<Role, TestMember> {
  const crew = {} as Record<Role, TestMember>;
  beforeAll(async () => {
    Object.assign(crew, await createCrew());
  });
  afterAll(async () => {
    const { closeDb } = await import("@/db/client");
    await closeDb();
  });
  return crew;
}

/** Request init for a JSON body sent as a member (POST unless told). */
export function jsonInit(as: TestMember, body: unknown, method = "POST") {
  return { method, as, body: JSON.stringify(body), headers: { "content-type": "application/json" } };
}

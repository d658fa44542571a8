/**
 * Real members for integration tests: users are signed up through better-auth against the
 * real database, put into a fresh organization with a role, and signed in for a real cookie.
 * Every call uses unique e-mails, so tests never collide with each other or with old data.
 */
import { randomUUID } from "node:crypto";
import { getAuth } from "@/lib/auth";
import { env } from "@/lib/env";
import type { Role } from "@/lib/permissions";

export interface TestMember {
  userId: string;
  email: string;
  password: string;
  name: string;
  role: Role;
  organizationId: string;
  /** Cookie header value for requests as this member. */
  cookie: string;
}

export const PASSWORD = "correct-horse-battery";

export function uniqueEmail(prefix: string): string {
  return `${prefix}-${randomUUID().slice(0, 8)}@example.test`;
}

async function signIn(email: string, password: string): Promise<string> {
  const res = await getAuth().api.signInEmail({ body: { email, password }, asResponse: true });
  if (!res.ok) throw new Error(`sign-in failed for ${email}: ${res.status} ${await res.text()}`);
  const cookies = res.headers.getSetCookie().map((c) => c.split(";")[0]);
  return cookies.join("; ");
}

/** A new organization with its owner. */
export async function createShop(name = `Shop ${randomUUID().slice(0, 6)}`): Promise<TestMember> {
  const email = uniqueEmail("owner");
  const { user } = await getAuth().api.signUpEmail({ body: { email, password: PASSWORD, name: "Olive Owner" } });
  const org = await getAuth().api.createOrganization({
    body: { name, slug: `shop-${randomUUID().slice(0, 12)}`, userId: user.id },
  });
  if (!org) throw new Error("organization not created");
  const cookie = await signIn(email, PASSWORD);
  return { userId: user.id, email, password: PASSWORD, name: user.name, role: "owner", organizationId: org.id, cookie };
}

/** A new user added to an existing organization with the given role, signed in. */
export async function addMember(organizationId: string, role: Role, name = `Member ${role}`): Promise<TestMember> {
  const email = uniqueEmail(role);
  const { user } = await getAuth().api.signUpEmail({ body: { email, password: PASSWORD, name } });
  await getAuth().api.addMember({ body: { userId: user.id, organizationId, role } });
  const cookie = await signIn(email, PASSWORD);
  return { userId: user.id, email, password: PASSWORD, name, role, organizationId, cookie };
}

/** One member of each role in one new organization. */
export async function createCrew(): Promise<Record<Role, TestMember>> {
  const owner = await createShop();
  const [lead, technician, trainer, apprentice] = await Promise.all(
    (["lead", "technician", "trainer", "apprentice"] as const).map((r) => addMember(owner.organizationId, r)),
  );
  return { owner, lead, technician, trainer, apprentice };
}

/** A Request to the app as a member (or anonymous when no member is given). */
export function appRequest(path: string, init: RequestInit & { as?: TestMember | null } = {}): Request {
  const headers = new Headers(init.headers);
  headers.set("origin", env().BETTER_AUTH_URL);
  if (init.as) headers.set("cookie", init.as.cookie);
  const { as: _as, ...rest } = init;
  void _as;
  return new Request(new URL(path, env().BETTER_AUTH_URL), { ...rest, headers });
}

/** The route context Next passes to a dynamic route handler. */
export function routeParams<T extends Record<string, string>>(params: T) {
  return { params: Promise.resolve(params) };
}

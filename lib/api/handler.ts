import { z, type ZodType } from "zod";
import { db } from "@/db/client";
import { getMembershipByUser } from "@/db/queries/members";
import { getAuth } from "@/lib/auth";
import { AppError } from "@/lib/errors";
import { describeError, log } from "@/lib/log";
import { can, mayUse, type Permission, type PolicyName, type Role } from "@/lib/permissions";
import { assertAcceptedBody, mediaTypeOf, readJsonBody, readMultipartBody, type BodyKind } from "./body";
import { assertSameOrigin } from "./csrf";
import { isDatabaseUnreachable } from "./failures";
import { toErrorResponse, zodDetails } from "./respond";
import { assertStorable } from "./storable";

export { toErrorResponse } from "./respond";

/** Who is calling: a signed-in member acting inside their active organization. */
export interface Actor {
  userId: string;
  name: string;
  email: string;
  organizationId: string;
  organizationName: string;
  role: Role;
}

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

interface Spec<B, Q, P> {
  /** The resource-level policy of lib/permissions.ts this handler serves (its role check runs here). */
  policy: PolicyName;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  params?: ZodType<P>;
  /**
   * What a state-changing request may carry: JSON by default. A route that takes files says
   * "multipart": the wrapper reads the form under the upload cap and hands it over as `form`; a
   * route that takes both gets a JSON body without a schema as `json` (under the JSON cap).
   */
  accepts?: readonly BodyKind[];
  /** Largest JSON body, bytes, for a route whose JSON carries a whole log; MAX_JSON_BYTES otherwise. */
  maxJsonBytes?: number;
}

interface Call<B, Q, P> {
  req: Request;
  actor: Actor;
  body: B;
  query: Q;
  params: P;
  /** The multipart form, read under the upload cap (routes that accept "multipart"). */
  form?: FormData;
  /** A JSON body read under the JSON cap, for a route that accepts both kinds and parses it itself. */
  json?: unknown;
}

/** The signed-in user, or 401; a database that does not answer is a 503, never a 500. */
export async function requireSession(headers: Headers) {
  try {
    const session = await getAuth().api.getSession({ headers });
    if (!session) throw new AppError("unauthenticated");
    return session;
  } catch (err) {
    if (err instanceof AppError) throw err;
    if (isDatabaseUnreachable(err)) throw new AppError("database_unavailable");
    log.error("session lookup failed", { err: describeError(err) });
    throw new AppError("internal");
  }
}

/** Reads the session and the membership; throws 401 / 403 / 503 AppErrors. */
export async function requireActor(headers: Headers): Promise<Actor> {
  const session = await requireSession(headers);
  const organizationId = session.session.activeOrganizationId;
  if (!organizationId) throw new AppError("no_organization");
  const membership = await getMembershipByUser(db(), { organizationId, userId: session.user.id }).catch((err: unknown) => {
    throw isDatabaseUnreachable(err) ? new AppError("database_unavailable") : err;
  });
  if (!membership) throw new AppError("no_organization");
  return {
    userId: session.user.id,
    name: session.user.name,
    email: session.user.email,
    organizationId,
    organizationName: membership.organizationName,
    role: membership.role,
  };
}

export function requirePolicy(actor: Actor, policy: PolicyName): void {
  if (!mayUse(actor.role, policy)) throw new AppError("forbidden", `Your role (${actor.role}) does not allow this.`);
}

/** A page's role check (lib/session.ts): one row of the permission matrix. */
export function requirePermission(actor: Actor, permission: Permission | "member"): void {
  if (permission !== "member" && !can(actor.role, permission)) throw new AppError("forbidden", `Your role (${actor.role}) does not allow this.`);
}

async function parsePart<T>(schema: ZodType<T> | undefined, value: unknown, where: string): Promise<T> {
  if (!schema) return undefined as T;
  assertStorable(value, where);
  const parsed = await schema.safeParseAsync(value);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    const field = first?.path.join(".") || where;
    throw new AppError("invalid_input", `${field}: ${first?.message ?? "not valid"}`, zodDetails(parsed.error, where));
  }
  return parsed.data;
}

/** The checks every request passes before anyone is looked up: same origin, accepted body type. */
function guardRequest(req: Request, accepts: readonly BodyKind[] = ["json"]): void {
  assertSameOrigin(req);
  assertAcceptedBody(req, accepts);
}

async function partsOf<B, Q, P>(spec: Omit<Spec<B, Q, P>, "policy">, req: Request, ctx?: RouteContext) {
  const params = await parsePart(spec.params, ctx ? await ctx.params : {}, "path");
  const query = await parsePart(spec.query, Object.fromEntries(new URL(req.url).searchParams), "query");
  const type = mediaTypeOf(req.headers);
  const takesFiles = spec.accepts?.includes("multipart") ?? false;
  const form = takesFiles && type === "multipart/form-data" ? await readMultipartBody(req) : undefined;
  const json = takesFiles && !spec.body && type === "application/json" ? await readJsonBody(req, spec.maxJsonBytes) : undefined;
  const body = spec.body ? await parsePart(spec.body, await readJsonBody(req, spec.maxJsonBytes), "body") : (undefined as B);
  return { params, query, body, form, json };
}

function answer(out: unknown): Response {
  return out instanceof Response ? out : Response.json(out);
}

/**
 * The one wrapper for every API route: same-origin and body-type checks → session →
 * organization → role → zod parse of params, query and JSON body (capped, storable) → call →
 * typed error mapping. A handler cannot skip a step.
 */
export function route<B = undefined, Q = undefined, P = undefined>(
  spec: Spec<B, Q, P>,
  fn: (call: Call<B, Q, P>) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx?: RouteContext): Promise<Response> => {
    try {
      guardRequest(req, spec.accepts);
      const actor = await requireActor(req.headers);
      requirePolicy(actor, spec.policy);
      const { params, query, body, form, json } = await partsOf(spec, req, ctx);
      return answer(await fn({ req, actor, body, query, params, form, json }));
    } catch (err) {
      return toErrorResponse(err, req);
    }
  };
}

/** For a signed-in person who need not belong to a shop yet (joining one): no membership check. */
export function signedInRoute<B = undefined, P = undefined>(
  spec: { body?: ZodType<B>; params?: ZodType<P> },
  fn: (call: { req: Request; user: { id: string; email: string; emailVerified: boolean }; body: B; params: P }) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx?: RouteContext): Promise<Response> => {
    try {
      guardRequest(req);
      const session = await requireSession(req.headers);
      const { params, body } = await partsOf(spec, req, ctx);
      const user = { id: session.user.id, email: session.user.email, emailVerified: session.user.emailVerified };
      return answer(await fn({ req, user, body, params }));
    } catch (err) {
      return toErrorResponse(err, req);
    }
  };
}

/** For routes that anyone may call (share links, health): origin check, zod parse and error mapping. */
export function publicRoute<Q = undefined, P = undefined>(
  spec: { query?: ZodType<Q>; params?: ZodType<P>; accepts?: readonly BodyKind[] },
  fn: (call: { req: Request; query: Q; params: P }) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx?: RouteContext): Promise<Response> => {
    try {
      guardRequest(req, spec.accepts);
      const { params, query } = await partsOf(spec, req, ctx);
      return answer(await fn({ req, query, params }));
    } catch (err) {
      return toErrorResponse(err, req);
    }
  };
}

export const uuidParam = z.object({ id: z.string().uuid("not a valid id") });

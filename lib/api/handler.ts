import { z, ZodError, type ZodType } from "zod";
import { db } from "@/db/client";
import { getMembershipByUser } from "@/db/queries/members";
import { getAuth } from "@/lib/auth";
import { AppError, errorResponse } from "@/lib/errors";
import { LogError } from "@/analysis/errors";
import { can, type Permission, type Role } from "@/lib/permissions";
import { log } from "@/lib/log";

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
  /** The matrix row this handler needs; "member" = any member of the organization. */
  permission: Permission | "member";
  body?: ZodType<B>;
  query?: ZodType<Q>;
  params?: ZodType<P>;
}

interface Call<B, Q, P> {
  req: Request;
  actor: Actor;
  body: B;
  query: Q;
  params: P;
}

/** Reads the session and the membership; throws 401 / 403 AppErrors. */
export async function requireActor(headers: Headers): Promise<Actor> {
  const session = await getAuth().api.getSession({ headers });
  if (!session) throw new AppError("unauthenticated");
  const organizationId = session.session.activeOrganizationId;
  if (!organizationId) throw new AppError("no_organization");
  const membership = await getMembershipByUser(db(), { organizationId, userId: session.user.id });
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

export function requirePermission(actor: Actor, permission: Permission | "member"): void {
  if (permission !== "member" && !can(actor.role, permission)) {
    throw new AppError("forbidden", `Your role (${actor.role}) does not allow this.`);
  }
}

function zodDetails(err: ZodError, where: string) {
  return {
    where,
    issues: err.issues.map((i) => ({ path: i.path.join("."), message: i.message })),
  };
}

async function parsePart<T>(schema: ZodType<T> | undefined, value: unknown, where: string): Promise<T> {
  if (!schema) return undefined as T;
  const parsed = await schema.safeParseAsync(value);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    const field = first?.path.join(".") || where;
    throw new AppError("invalid_input", `${field}: ${first?.message ?? "not valid"}`, zodDetails(parsed.error, where));
  }
  return parsed.data;
}

/** Maps any thrown value to a response. Details go to the log, never to the client. */
export function toErrorResponse(err: unknown, req: Request): Response {
  if (err instanceof AppError) return errorResponse(err);
  if (err instanceof LogError) {
    return errorResponse(new AppError("invalid_file", err.message, { reason: err.code, line: err.line, column: err.column }));
  }
  if (err instanceof ZodError) return errorResponse(new AppError("invalid_input", undefined, zodDetails(err, "request")));
  const code = (err as { code?: string })?.code;
  if (code === "ECONNREFUSED" || code === "57P01" || code === "53300") {
    log.error("database unavailable", { url: req.url, err: String(err) });
    return errorResponse(new AppError("database_unavailable"));
  }
  log.error("unhandled error", { url: req.url, err: err instanceof Error ? err.stack ?? err.message : String(err) });
  return errorResponse(new AppError("internal"));
}

/**
 * The one wrapper for every API route: session → organization → role → zod parse of params,
 * query and JSON body → call → typed error mapping. A handler cannot skip a step.
 */
export function route<B = undefined, Q = undefined, P = undefined>(
  spec: Spec<B, Q, P>,
  fn: (call: Call<B, Q, P>) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx?: RouteContext): Promise<Response> => {
    try {
      const actor = await requireActor(req.headers);
      requirePermission(actor, spec.permission);
      const params = await parsePart(spec.params, ctx ? await ctx.params : {}, "path");
      const query = await parsePart(spec.query, Object.fromEntries(new URL(req.url).searchParams), "query");
      let body: B = undefined as B;
      if (spec.body) {
        let json: unknown;
        try {
          json = await req.json();
        } catch {
          throw new AppError("invalid_input", "The request body is not valid JSON.");
        }
        body = await parsePart(spec.body, json, "body");
      }
      const out = await fn({ req, actor, body, query, params });
      return out instanceof Response ? out : Response.json(out);
    } catch (err) {
      return toErrorResponse(err, req);
    }
  };
}

/** For routes that anyone may call (share links, health): zod parse and error mapping only. */
export function publicRoute<Q = undefined, P = undefined>(
  spec: { query?: ZodType<Q>; params?: ZodType<P> },
  fn: (call: { req: Request; query: Q; params: P }) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx?: RouteContext): Promise<Response> => {
    try {
      const params = await parsePart(spec.params, ctx ? await ctx.params : {}, "path");
      const query = await parsePart(spec.query, Object.fromEntries(new URL(req.url).searchParams), "query");
      const out = await fn({ req, query, params });
      return out instanceof Response ? out : Response.json(out);
    } catch (err) {
      return toErrorResponse(err, req);
    }
  };
}

export const uuidParam = z.object({ id: z.string().uuid("not a valid id") });

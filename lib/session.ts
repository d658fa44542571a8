import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { requireActor, requirePermission, type Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import type { Permission } from "@/lib/permissions";

/**
 * For server components and pages: the signed-in member, or a redirect to sign-in
 * (or to the "no shop yet" page). Pages use this; API routes use `route()`.
 */
export async function pageActor(permission: Permission | "member" = "member"): Promise<Actor> {
  let actor: Actor;
  try {
    actor = await requireActor(await headers());
  } catch (err) {
    if (err instanceof AppError && err.code === "unauthenticated") redirect("/sign-in");
    if (err instanceof AppError && err.code === "no_organization") redirect("/no-shop");
    throw err;
  }
  try {
    requirePermission(actor, permission);
  } catch {
    redirect("/home?denied=1");
  }
  return actor;
}

import "server-only";
import type { z } from "zod";
import { db } from "@/db";
import { lessonAccess, type LessonAccess } from "@/db/queries/lessons";
import { can, roleLabel } from "@/lib/auth/permissions";
import { currentUser, type SignedIn } from "./authed";
import { ApiError } from "./errors";
import { route } from "./route";

type LessonCtx<TBody> = { req: Request; body: TBody; params: Record<string, string>; user: SignedIn; lesson: LessonAccess & { role: string } };

/**
 * A route on one lesson: 401 signed out; 404 unless the caller is in the lesson's class; then "read" lets any
 * member in, "copy" needs the right to make work there, "manage" is the instructor's (publish rights).
 */
export function lessonRoute<S extends z.ZodType | undefined = undefined>(
  options: { need: "read" | "copy" | "manage"; body?: S },
  handler: (ctx: LessonCtx<S extends z.ZodType ? z.infer<S> : undefined>) => Promise<Response> | Response,
) {
  return route({ body: options.body }, async (ctx) => {
    const user = await currentUser(ctx.req);
    if (!user) throw new ApiError(401, "signed-out", "Sign in first.");
    const found = ctx.params.lessonId ? await lessonAccess(db, ctx.params.lessonId, user.id) : undefined;
    if (!found?.role || !can(found.role, "lessons.read")) throw new ApiError(404, "not-found", "There is no such lesson, or it is not in a class of yours.");
    const as = roleLabel(found.organizationKind, found.role);
    if (options.need === "copy" && !can(found.role, "work.create")) {
      throw new ApiError(403, "forbidden", `As ${as} in ${found.organizationName} you can open lessons but not make work of your own there.`);
    }
    if (options.need === "manage" && !can(found.role, "lessons.publish")) {
      throw new ApiError(403, "forbidden", `Only the class's instructors manage its lessons; you are ${as} in ${found.organizationName}.`);
    }
    return handler({ ...ctx, user, lesson: { ...found, role: found.role } } as LessonCtx<S extends z.ZodType ? z.infer<S> : undefined>);
  });
}

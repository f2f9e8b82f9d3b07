/**
 * Who may do what, as data: one row per role. Every /api/v1 route names the permission it needs, and the
 * permission test walks this table. Work permissions split "all" (the organisation's) from "own" (one's own).
 */
export const ROLES = ["owner", "lead", "technician", "student", "viewer"] as const;
export type Role = (typeof ROLES)[number];
export type OrgKind = "shop" | "class";

export const PERMISSIONS = [
  "org.read",
  "org.update",
  "org.delete",
  "members.read",
  "members.invite",
  "members.remove",
  "members.role",
  "limits.set",
  "work.create",
  "work.read.all",
  "work.edit.all",
  "work.read.own",
  "work.edit.own",
  "share.create",
  "lessons.read",
  "lessons.publish",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

export const MATRIX: Record<Role, readonly Permission[]> = {
  owner: PERMISSIONS,
  lead: PERMISSIONS.filter((p) => p !== "org.delete"),
  technician: ["org.read", "members.read", "work.create", "work.read.all", "work.edit.all", "work.read.own", "work.edit.own", "share.create", "lessons.read"],
  student: ["org.read", "work.create", "work.read.own", "work.edit.own", "share.create", "lessons.read"],
  viewer: ["org.read", "members.read", "work.read.all", "work.read.own", "lessons.read"],
};

export function can(role: string, permission: Permission): boolean {
  return (MATRIX as Record<string, readonly Permission[]>)[role]?.includes(permission) ?? false;
}

/** Role names as each kind of organisation shows them; a role missing here is not offered there. */
export const ROLE_LABELS: Record<OrgKind, Partial<Record<Role, string>>> = {
  shop: { owner: "Owner", lead: "Shop lead", technician: "Technician", viewer: "Viewer" },
  class: { owner: "Owner", lead: "Instructor", student: "Student", viewer: "Observer" },
};

export function roleLabel(kind: string, role: string): string {
  return ROLE_LABELS[kind as OrgKind]?.[role as Role] ?? role;
}

/** Roles an owner or lead may give by invitation or change to (never owner: ownership is not handed out so). */
export function assignableRoles(kind: OrgKind, byRole: string): Role[] {
  if (!can(byRole, "members.role") && !can(byRole, "members.invite")) return [];
  return (Object.keys(ROLE_LABELS[kind]) as Role[]).filter((r) => r !== "owner");
}

/**
 * better-auth's own routes (under /api/auth) that Ampwright uses, and who may call them; every other route the
 * library has (its organisation routes among them) answers 404, so this table decides them too. The library
 * itself enforces "signed-in" on the routes marked so.
 */
export const AUTH_ROUTES = [
  { method: "POST", path: "/sign-up/email", who: "anyone" },
  { method: "POST", path: "/sign-in/email", who: "anyone" },
  { method: "POST", path: "/sign-out", who: "signed-in" },
  { method: "GET", path: "/get-session", who: "anyone" },
  { method: "GET", path: "/verify-email", who: "anyone" },
  { method: "POST", path: "/send-verification-email", who: "anyone" },
  { method: "POST", path: "/request-password-reset", who: "anyone" },
  { method: "GET", path: "/reset-password/:token", who: "anyone" },
  { method: "POST", path: "/reset-password", who: "anyone" },
  { method: "POST", path: "/change-password", who: "signed-in" },
  { method: "POST", path: "/delete-user", who: "signed-in" },
] as const satisfies readonly { method: "GET" | "POST"; path: string; who: "anyone" | "signed-in" }[];

/** Whether a better-auth path (after /api/auth) is one Ampwright serves. */
export function authRouteOpen(method: string, path: string): boolean {
  const parts = path.replace(/\/+$/, "").split("/");
  return AUTH_ROUTES.some((r) => {
    if (r.method !== method) return false;
    const want = r.path.split("/");
    return want.length === parts.length && want.every((w, i) => (w.startsWith(":") ? parts[i].length > 0 : w === parts[i]));
  });
}

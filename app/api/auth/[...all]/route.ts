import { toNextJsHandler } from "better-auth/next-js";
import { errorResponse } from "@/lib/api/errors";
import { auth } from "@/lib/auth/server";
import { authRouteOpen } from "@/lib/auth/permissions";

const handlers = toNextJsHandler(auth);

/** Only the better-auth routes in AUTH_ROUTES reach the library; the rest do not exist as far as a caller can tell. */
function gate(method: "GET" | "POST") {
  return async (req: Request) => {
    const path = new URL(req.url).pathname.replace(/^\/api\/auth/, "");
    if (!authRouteOpen(method, path)) return errorResponse(404, "not-found", "There is no such page.");
    return handlers[method](req);
  };
}

// GET|POST /api/auth/* - better-auth, for the routes in AUTH_ROUTES only: sign-up, sign-in, sign-out, session,
// confirmation, password reset and change, account deletion
export const GET = gate("GET");
export const POST = gate("POST");

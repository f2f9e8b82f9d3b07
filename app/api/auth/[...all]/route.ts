import { toNextJsHandler } from "better-auth/next-js";
import { auth } from "@/lib/auth/server";

// GET|POST /api/auth/* - better-auth: sign-up, sign-in, sign-out, verification, password reset, sessions
export const { GET, POST } = toNextJsHandler(auth);

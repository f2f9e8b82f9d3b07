import { db } from "@/db";
import { listLessons } from "@/db/queries/lessons";
import { userRoute } from "@/lib/api/authed";

// GET /api/v1/lessons - lessons of every class the caller is in, with what they did with each (instructors also see counts)
export const GET = userRoute({}, async ({ user }) => {
  return Response.json({ lessons: await listLessons(db, user.id) });
});

import "server-only";
import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { auth } from "./server";

/** The signed-in user for a page, or a redirect to sign-in that comes back here. */
export async function requireUser(returnTo: string) {
  const session = await auth.api.getSession({ headers: await headers() });
  if (!session) redirect(`/sign-in?next=${encodeURIComponent(returnTo)}`);
  return session.user;
}

export async function optionalUser() {
  const session = await auth.api.getSession({ headers: await headers() });
  return session?.user;
}

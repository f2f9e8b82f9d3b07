import type { Metadata } from "next";
import Link from "next/link";
import { AcceptButton } from "@/components/organizations/invite-form";
import { AuthCard } from "@/components/ui/field";
import { db } from "@/db";
import { findInvitation } from "@/db/queries/invitations";
import { roleLabel } from "@/lib/auth/permissions";
import { optionalUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Invitation" };

export default async function Page({ params }: { params: Promise<{ invitationId: string }> }) {
  const { invitationId } = await params;
  const inv = await findInvitation(db, invitationId);
  const user = await optionalUser();
  const here = `/invitations/${invitationId}`;
  if (!inv || inv.status === "canceled" || inv.expired) {
    return (
      <AuthCard title="This invitation is not valid">
        <p>It may have expired or been withdrawn. Ask whoever invited you to send a new one.</p>
      </AuthCard>
    );
  }
  return (
    <AuthCard title={`Join ${inv.organizationName}`}>
      <p data-testid="invitation-summary">
        {inv.inviterName} invites <strong>{inv.email}</strong> to join this {inv.kind} as <strong>{roleLabel(inv.kind, inv.role ?? "")}</strong>.
      </p>
      <div className="mt-5">
        {!user ? (
          <p className="text-sm">
            <Link href={`/sign-in?next=${encodeURIComponent(here)}`} className="font-semibold text-copper-700 underline underline-offset-2" data-testid="invitation-sign-in">
              Sign in
            </Link>{" "}
            or{" "}
            <Link href={`/sign-up?next=${encodeURIComponent(here)}`} className="font-semibold text-copper-700 underline underline-offset-2" data-testid="invitation-sign-up">
              create an account
            </Link>{" "}
            with {inv.email} to accept.
          </p>
        ) : user.email.toLowerCase() !== inv.email.toLowerCase() ? (
          <p className="text-sm text-over">You are signed in as {user.email}. Sign out and sign in with {inv.email} to accept this invitation.</p>
        ) : inv.status === "accepted" ? (
          <Link href={`/organizations/${inv.organizationId}`} className="font-semibold text-copper-700 underline">
            You are a member already: open {inv.organizationName}
          </Link>
        ) : (
          <AcceptButton invitationId={inv.id} orgId={inv.organizationId} />
        )}
      </div>
    </AuthCard>
  );
}

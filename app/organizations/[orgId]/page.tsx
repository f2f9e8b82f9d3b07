import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { InviteForm, RevokeButton } from "@/components/organizations/invite-form";
import { LimitsForm } from "@/components/organizations/limits-form";
import { OwnPlans } from "@/components/organizations/own-plans";
import { db } from "@/db";
import { listInvitations } from "@/db/queries/invitations";
import { getLimits } from "@/db/queries/limits";
import { listOwnPlans } from "@/db/queries/plans";
import { findMembership, listMembers } from "@/db/queries/organizations";
import { assignableRoles, can, roleLabel, type OrgKind } from "@/lib/auth/permissions";
import { requireUser } from "@/lib/auth/session";
import { formatWhen } from "@/lib/format";

export const metadata: Metadata = { title: "Organisation" };

export default async function Page({ params }: { params: Promise<{ orgId: string }> }) {
  const { orgId } = await params;
  const user = await requireUser(`/organizations/${orgId}`);
  const me = await findMembership(db, { userId: user.id, organizationId: orgId });
  if (!me) notFound(); // another organisation's id looks like no organisation at all
  const kind = me.kind as OrgKind;
  const members = can(me.role, "members.read") ? await listMembers(db, orgId) : [];
  const mayInvite = can(me.role, "members.invite");
  const invitations = mayInvite ? await listInvitations(db, orgId) : [];
  const limits = await getLimits(db, orgId);
  const ownPlans = await listOwnPlans(db, orgId);
  return (
    <div className="mx-auto max-w-4xl px-4 py-10 sm:px-6">
      <p className="text-sm font-semibold uppercase tracking-wider text-copper-600">{kind === "class" ? "Class" : "Shop"}</p>
      <h1 className="mt-1 text-3xl font-semibold tracking-tight" data-testid="org-title">
        {me.name}
      </h1>
      <p className="mt-2 text-graphite-700">
        You are <strong data-testid="org-my-role">{roleLabel(kind, me.role)}</strong> here.
      </p>
      {members.length ? (
        <section className="mt-8">
          <h2 className="text-xl font-semibold">People</h2>
          <ul className="mt-3 divide-y divide-graphite-100 rounded-lg border border-graphite-100 bg-paper-raised" data-testid="member-list">
            {members.map((m) => (
              <li key={m.id} className="flex flex-wrap items-center justify-between gap-2 px-5 py-3">
                <span>
                  <span className="font-medium">{m.name}</span> <span className="text-sm text-graphite-500">{m.email}</span>
                </span>
                <span className="text-sm text-graphite-700">{roleLabel(kind, m.role)}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {mayInvite ? (
        <section className="mt-8">
          <h2 className="text-xl font-semibold">Invite someone</h2>
          <div className="mt-3 rounded-lg border border-graphite-100 bg-paper-raised p-5">
            <InviteForm orgId={orgId} roles={assignableRoles(kind, me.role).map((r) => ({ role: r, label: roleLabel(kind, r) }))} />
          </div>
          {invitations.length ? (
            <ul className="mt-4 space-y-2 text-sm" data-testid="invitation-list">
              {invitations.map((i) => (
                <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-graphite-100 bg-white px-4 py-2">
                  <span>
                    {i.email} as {roleLabel(kind, i.role ?? "")}, until {i.expiresAt.toISOString().slice(0, 10)}
                  </span>
                  <RevokeButton orgId={orgId} invitationId={i.id} />
                </li>
              ))}
            </ul>
          ) : null}
        </section>
      ) : null}
      <section className="mt-8" aria-labelledby="limits-h">
        <h2 id="limits-h" className="text-xl font-semibold">
          Diagnosis limits
        </h2>
        <LimitsForm
          orgId={orgId}
          canEdit={can(me.role, "limits.set")}
          limits={limits.limits}
          own={limits.own}
          updated={limits.updatedAt ? `Last changed ${formatWhen(limits.updatedAt)}${limits.updatedByName ? ` by ${limits.updatedByName}` : ""}.` : null}
        />
      </section>
      <section className="mt-8" aria-labelledby="plans-h">
        <h2 id="plans-h" className="text-xl font-semibold">
          Test plans of your own
        </h2>
        <OwnPlans orgId={orgId} canEdit={can(me.role, "limits.set")} plans={ownPlans} />
      </section>
    </div>
  );
}

"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { Field, FormError } from "@/components/ui/field";
import { apiFetch, type ApiClientError } from "@/lib/query/client";
import { inviteInput, type InviteInput } from "@/lib/validators/organizations";

export function InviteForm({ orgId, roles }: { orgId: string; roles: { role: InviteInput["role"]; label: string }[] }) {
  const router = useRouter();
  const form = useForm<InviteInput>({ resolver: zodResolver(inviteInput), defaultValues: { email: "", role: roles[roles.length - 1]?.role } });
  const invite = useMutation<unknown, ApiClientError, InviteInput>({
    mutationFn: (json) => apiFetch(`/api/v1/organizations/${orgId}/invitations`, { method: "POST", json }),
    onSuccess: () => {
      form.reset({ email: "", role: form.getValues("role") });
      router.refresh();
    },
  });
  return (
    <form onSubmit={form.handleSubmit((v) => invite.mutate(v))} className="grid gap-4 sm:grid-cols-[1fr_auto_auto] sm:items-end" noValidate>
      <Field label="E-mail address" type="email" registration={form.register("email")} error={form.formState.errors.email?.message} testId="invite-email" />
      <label className="block text-sm">
        <span className="font-medium text-graphite-800">Role</span>
        <select className="mt-1 block w-full rounded-md border border-graphite-300 bg-white px-3 py-2" {...form.register("role")} data-testid="invite-role">
          {roles.map((r) => (
            <option key={r.role} value={r.role}>
              {r.label}
            </option>
          ))}
        </select>
      </label>
      <button type="submit" className="rounded-md bg-copper-600 px-4 py-2.5 font-semibold text-white hover:bg-copper-700" disabled={invite.isPending} data-testid="invite-send">
        Send the invitation
      </button>
      <div className="sm:col-span-3">
        <FormError message={invite.error?.message} />
        {invite.isSuccess ? <p className="text-sm text-within" data-testid="invite-sent">Invitation sent. It expires in 7 days.</p> : null}
      </div>
    </form>
  );
}

export function RevokeButton({ orgId, invitationId }: { orgId: string; invitationId: string }) {
  const router = useRouter();
  const revoke = useMutation<unknown, ApiClientError>({
    mutationFn: () => apiFetch(`/api/v1/organizations/${orgId}/invitations/${invitationId}`, { method: "DELETE" }),
    onSuccess: () => router.refresh(),
  });
  return (
    <button type="button" className="text-sm text-over underline underline-offset-2" onClick={() => revoke.mutate()} disabled={revoke.isPending}>
      Withdraw
    </button>
  );
}

export function AcceptButton({ invitationId, orgId }: { invitationId: string; orgId: string }) {
  const router = useRouter();
  const accept = useMutation<unknown, ApiClientError>({
    mutationFn: () => apiFetch(`/api/v1/invitations/${invitationId}/accept`, { method: "POST" }),
    onSuccess: () => router.push(`/organizations/${orgId}`),
  });
  return (
    <div>
      <button type="button" className="rounded-md bg-copper-600 px-5 py-2.5 font-semibold text-white hover:bg-copper-700" onClick={() => accept.mutate()} disabled={accept.isPending} data-testid="invitation-accept">
        Accept and join
      </button>
      <FormError message={accept.error?.message} />
    </div>
  );
}

"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, FormError } from "@/components/ui/field";
import { authClient } from "@/lib/auth/client";
import { changePasswordInput, deleteAccountInput } from "@/lib/validators/auth";

export function ChangePasswordForm() {
  const [done, setDone] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<z.infer<typeof changePasswordInput>>({ resolver: zodResolver(changePasswordInput) });
  const submit = form.handleSubmit(async (v) => {
    setError(null);
    setDone(false);
    const { error: e } = await authClient.changePassword({ currentPassword: v.currentPassword, newPassword: v.password, revokeOtherSessions: true });
    if (e) return setError("The current password is not right. Try again.");
    form.reset();
    setDone(true);
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <FormError message={error} />
      <Field label="Current password" type="password" autoComplete="current-password" registration={form.register("currentPassword")} error={form.formState.errors.currentPassword?.message} />
      <Field label="New password" type="password" autoComplete="new-password" registration={form.register("password")} error={form.formState.errors.password?.message} />
      <Field label="The same again" type="password" autoComplete="new-password" registration={form.register("confirm")} error={form.formState.errors.confirm?.message} />
      <button type="submit" className="rounded-md bg-graphite-900 px-4 py-2 font-semibold text-white hover:bg-graphite-700">
        Change the password
      </button>
      {done ? <p className="text-sm text-within">Changed. Other devices were signed out.</p> : null}
    </form>
  );
}

export function DeleteAccountForm() {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const form = useForm<z.infer<typeof deleteAccountInput>>({ resolver: zodResolver(deleteAccountInput) });
  const submit = form.handleSubmit(async (v) => {
    setError(null);
    const { error: e } = await authClient.deleteUser({ password: v.password });
    if (e) return setError(e.message ?? "The account could not be deleted. Check the password.");
    router.push("/");
    router.refresh();
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <FormError message={error} />
      <Field label="Your password, to confirm" type="password" autoComplete="current-password" registration={form.register("password")} error={form.formState.errors.password?.message} />
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" {...form.register("confirm")} className="mt-1" />
        <span>I understand that my personal workshop and its work are deleted for good.</span>
      </label>
      {form.formState.errors.confirm ? <p className="text-sm text-over">{form.formState.errors.confirm.message}</p> : null}
      <button type="submit" className="rounded-md bg-over px-4 py-2 font-semibold text-white hover:opacity-90">
        Delete my account
      </button>
    </form>
  );
}

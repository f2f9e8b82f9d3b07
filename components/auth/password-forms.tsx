"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Field, FormError, primaryButton } from "@/components/ui/field";
import { authClient } from "@/lib/auth/client";
import { forgotPasswordInput, resetPasswordInput } from "@/lib/validators/auth";

export function ForgotPasswordForm() {
  const [sent, setSent] = useState(false);
  const form = useForm<z.infer<typeof forgotPasswordInput>>({ resolver: zodResolver(forgotPasswordInput) });
  const submit = form.handleSubmit(async ({ email }) => {
    await authClient.requestPasswordReset({ email, redirectTo: "/reset-password" });
    setSent(true); // the same answer whether or not the address has an account
  });
  if (sent) {
    return (
      <p data-testid="reset-sent">
        If that address has an account, a message with a link to choose a new password is on its way. The link works for one hour.
      </p>
    );
  }
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <Field label="E-mail" type="email" autoComplete="email" registration={form.register("email")} error={form.formState.errors.email?.message} testId="forgot-email" />
      <button type="submit" className={primaryButton} disabled={form.formState.isSubmitting} data-testid="forgot-submit">
        Send the link
      </button>
    </form>
  );
}

export function ResetPasswordForm() {
  const router = useRouter();
  const params = useSearchParams();
  const token = params.get("token");
  const [error, setError] = useState<string | null>(params.get("error") ? "This link has expired or was used already. Ask for a new one." : null);
  const form = useForm<z.infer<typeof resetPasswordInput>>({ resolver: zodResolver(resetPasswordInput) });
  const submit = form.handleSubmit(async ({ password }) => {
    if (!token) return setError("This page needs the link from the reset message. Ask for a new one.");
    const { error: e } = await authClient.resetPassword({ newPassword: password, token });
    if (e) return setError("This link has expired or was used already. Ask for a new one.");
    router.push("/sign-in?reset=1");
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      <FormError message={error} />
      <Field label="New password" type="password" autoComplete="new-password" registration={form.register("password")} error={form.formState.errors.password?.message} />
      <Field label="The same again" type="password" autoComplete="new-password" registration={form.register("confirm")} error={form.formState.errors.confirm?.message} />
      <button type="submit" className={primaryButton} disabled={form.formState.isSubmitting}>
        Save the new password
      </button>
      <p className="text-sm">
        <Link href="/forgot-password" className="text-copper-700 underline underline-offset-2">
          Ask for a new link
        </Link>
      </p>
    </form>
  );
}

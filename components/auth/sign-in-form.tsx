"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { safeLocalPath } from "@/lib/net/redirect";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormError, primaryButton } from "@/components/ui/field";
import { authClient } from "@/lib/auth/client";
import { signInInput, type SignInInput } from "@/lib/validators/auth";

export function SignInForm() {
  const router = useRouter();
  const next = safeLocalPath(useSearchParams().get("next"));
  const [error, setError] = useState<string | null>(null);
  const form = useForm<SignInInput>({ resolver: zodResolver(signInInput) });
  const submit = form.handleSubmit(async (values) => {
    setError(null);
    const { error: e } = await authClient.signIn.email({ email: values.email, password: values.password });
    if (e) {
      setError(
        e.status === 403
          ? "Confirm your e-mail address first: follow the link in the message we sent. It can take a minute to arrive."
          : e.status === 429
            ? "Too many attempts. Wait a minute, then try again."
            : "That e-mail address and password do not match. Check them, or reset the password.",
      );
      return;
    }
    router.push(next);
    router.refresh();
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate data-testid="sign-in-form">
      <FormError message={error} />
      <Field label="E-mail" type="email" autoComplete="email" registration={form.register("email")} error={form.formState.errors.email?.message} testId="sign-in-email" />
      <Field label="Password" type="password" autoComplete="current-password" registration={form.register("password")} error={form.formState.errors.password?.message} testId="sign-in-password" />
      <button type="submit" className={primaryButton} disabled={form.formState.isSubmitting} data-testid="sign-in-submit">
        {form.formState.isSubmitting ? "Signing in…" : "Sign in"}
      </button>
      <p className="flex justify-between text-sm">
        <Link href="/forgot-password" className="text-copper-700 underline underline-offset-2">
          Forgot the password?
        </Link>
        <Link href="/sign-up" className="text-copper-700 underline underline-offset-2">
          Create an account
        </Link>
      </p>
    </form>
  );
}

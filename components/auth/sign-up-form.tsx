"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { safeLocalPath } from "@/lib/net/redirect";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormError, primaryButton } from "@/components/ui/field";
import { authClient } from "@/lib/auth/client";
import { PASSWORD_MIN, signUpInput, type SignUpInput } from "@/lib/validators/auth";

export function SignUpForm() {
  const router = useRouter();
  const next = useSearchParams().get("next");
  const callbackURL = safeLocalPath(next);
  const [error, setError] = useState<string | null>(null);
  const form = useForm<SignUpInput>({ resolver: zodResolver(signUpInput) });
  const submit = form.handleSubmit(async (values) => {
    setError(null);
    const { error: e } = await authClient.signUp.email({ ...values, callbackURL });
    if (e) {
      setError(
        e.status === 422 || /exist/i.test(e.message ?? "")
          ? "An account with this address exists already. Sign in, or reset its password."
          : e.status === 429
            ? "Too many attempts. Wait a minute, then try again."
            : "The account could not be created. Check the fields and try again.",
      );
      return;
    }
    router.push(`/check-email?to=${encodeURIComponent(values.email)}`);
  });
  return (
    <form onSubmit={submit} className="space-y-4" noValidate data-testid="sign-up-form">
      <FormError message={error} />
      <Field label="Your name" autoComplete="name" registration={form.register("name")} error={form.formState.errors.name?.message} testId="sign-up-name" />
      <Field label="E-mail" type="email" autoComplete="email" registration={form.register("email")} error={form.formState.errors.email?.message} testId="sign-up-email" />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters. A short sentence is easy to remember.`}
        registration={form.register("password")}
        error={form.formState.errors.password?.message}
        testId="sign-up-password"
      />
      <button type="submit" className={primaryButton} disabled={form.formState.isSubmitting} data-testid="sign-up-submit">
        {form.formState.isSubmitting ? "Creating…" : "Create the account"}
      </button>
      <p className="text-sm text-graphite-700">
        You get a workshop of your own; a shop or class can invite you into theirs. Already have an account?{" "}
        <Link href="/sign-in" className="text-copper-700 underline underline-offset-2">
          Sign in
        </Link>
        .
      </p>
    </form>
  );
}

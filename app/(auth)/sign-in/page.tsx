import type { Metadata } from "next";
import { Suspense } from "react";
import { SignInForm } from "@/components/auth/sign-in-form";
import { AuthCard } from "@/components/ui/field";

export const metadata: Metadata = { title: "Sign in" };

export default function Page() {
  return (
    <AuthCard title="Sign in to Ampwright">
      <Suspense>
        <SignInForm />
      </Suspense>
    </AuthCard>
  );
}

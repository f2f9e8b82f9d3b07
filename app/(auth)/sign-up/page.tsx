import type { Metadata } from "next";
import { Suspense } from "react";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { AuthCard } from "@/components/ui/field";

export const metadata: Metadata = { title: "Create an account" };

export default function Page() {
  return (
    <AuthCard title="Create your Ampwright account">
      <Suspense>
        <SignUpForm />
      </Suspense>
    </AuthCard>
  );
}

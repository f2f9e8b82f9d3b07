import type { Metadata } from "next";
import { ForgotPasswordForm } from "@/components/auth/password-forms";
import { AuthCard } from "@/components/ui/field";

export const metadata: Metadata = { title: "Reset the password" };

export default function Page() {
  return (
    <AuthCard title="Reset the password">
      <ForgotPasswordForm />
    </AuthCard>
  );
}

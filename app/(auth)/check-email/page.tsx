import type { Metadata } from "next";
import Link from "next/link";
import { AuthCard } from "@/components/ui/field";

export const metadata: Metadata = { title: "Check your e-mail" };

export default async function Page({ searchParams }: { searchParams: Promise<{ to?: string }> }) {
  const { to } = await searchParams;
  return (
    <AuthCard title="Check your e-mail">
      <p data-testid="check-email">
        We sent a confirmation link to <strong>{to ?? "your address"}</strong>. Follow it to finish setting up the account; it works for
        one hour.
      </p>
      <p className="mt-4 text-sm text-graphite-700">
        Nothing after a few minutes? Look in the spam folder, or{" "}
        <Link href="/sign-up" className="text-copper-700 underline underline-offset-2">
          sign up again
        </Link>{" "}
        with the address spelled right.
      </p>
    </AuthCard>
  );
}

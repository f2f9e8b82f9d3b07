import type { Metadata } from "next";
import Link from "next/link";
import { ChangePasswordForm, DeleteAccountForm } from "@/components/account/account-forms";
import { requireUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Your account" };

export default async function Page() {
  const user = await requireUser("/account");
  return (
    <div className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight">Your account</h1>
      <p className="mt-2 text-graphite-700">
        {user.name}, {user.email} ·{" "}
        <Link href="/organizations" className="text-copper-700 underline underline-offset-2">
          your shops and classes
        </Link>
      </p>
      <section className="mt-8 rounded-lg border border-graphite-100 bg-paper-raised p-5">
        <h2 className="text-lg font-semibold">Password</h2>
        <div className="mt-4">
          <ChangePasswordForm />
        </div>
      </section>
      <section className="mt-8 rounded-lg border border-over/30 bg-paper-raised p-5">
        <h2 className="text-lg font-semibold">Delete the account</h2>
        <p className="mt-2 text-sm text-graphite-700">
          What goes and what stays is set out in the{" "}
          <Link href="/privacy" className="text-copper-700 underline underline-offset-2">
            privacy notes
          </Link>
          .
        </p>
        <div className="mt-4">
          <DeleteAccountForm />
        </div>
      </section>
    </div>
  );
}

import type { Metadata } from "next";

export const metadata: Metadata = { title: "Privacy" };

export default function Page() {
  return (
    <article className="mx-auto max-w-2xl px-4 py-10 sm:px-6">
      <h1 className="text-3xl font-semibold tracking-tight">Privacy notes</h1>
      <h2 className="mt-8 text-xl font-semibold">What Ampwright keeps</h2>
      <ul className="mt-3 list-disc space-y-2 pl-5 text-graphite-700">
        <li>Your name, e-mail address and a salted hash of your password (never the password itself).</li>
        <li>Sessions: when you signed in, from which address and browser, so you can be signed out everywhere.</li>
        <li>Which shops and classes you belong to, and your role in each.</li>
        <li>The work you and your colleagues save: vehicles, jobs, circuits, readings, photos and reports, kept inside the organisation they belong to and shown to no other.</li>
        <li>Mail sent to you (confirmations, password resets, invitations) until it is delivered, and counts of sign-in attempts for one day, to stop password guessing.</li>
      </ul>
      <h2 className="mt-8 text-xl font-semibold">When you delete your account</h2>
      <ul className="mt-3 list-disc space-y-2 pl-5 text-graphite-700">
        <li>Your sign-in, sessions and memberships are deleted at once.</li>
        <li>Organisations where you are the only member (your personal workshop among them) are deleted with everything in them.</li>
        <li>Work you saved in a shop or class that others still use stays with that organisation: it belongs to the shop or class, not to you.</li>
        <li>An organisation you own that others use must be handed over or deleted first; Ampwright says so instead of deleting it.</li>
        <li>Invitations you sent are withdrawn.</li>
      </ul>
    </article>
  );
}

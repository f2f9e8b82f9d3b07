import type { Metadata } from "next";
import { SizingCalculator } from "@/components/sizing/sizing-calculator";
import { SafetyNote } from "@/components/ui/safety-note";

export const metadata: Metadata = { title: "Size a cable" };

export default function Page() {
  return (
    <div className="mx-auto max-w-7xl px-4 py-10 sm:px-6">
      <p className="text-sm font-semibold uppercase tracking-wider text-copper-600">Sizing</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">Cable and fuse for an added load</h1>
      <p className="mt-2 max-w-3xl text-graphite-700">
        Type the load and the run; the size updates as you type. It is decided by the voltage drop over the whole path at peak current, by the
        heat the cable may carry where it is routed, and by the fuse that must protect it.
      </p>
      <div className="mt-6">
        <SizingCalculator />
      </div>
      <div className="mt-8">
        <SafetyNote compact />
      </div>
      <p className="mt-4 text-sm text-graphite-500">
        Check the result against the cable and fuse makers&rsquo; data and the vehicle maker&rsquo;s body-builder information; local codes and
        licensed practice come first.
      </p>
    </div>
  );
}

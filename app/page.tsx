import Link from "next/link";
import { QuickCheck } from "@/components/quick-check/quick-check";
import { DropIllustration } from "@/components/shell/drop-illustration";
import { SafetyNote } from "@/components/ui/safety-note";
import { areas } from "@/lib/areas";

const audiences = [
  {
    who: "Technicians",
    job: "A battery light, a flat battery, a slow crank.",
    how: "Check state of charge and the feeds, then measure the drop along the positive and the ground paths under load. Ampwright shows what each reading should be, points at the joint that eats the voltage, and writes the verdict and repair order in words a service writer and a customer follow.",
  },
  {
    who: "Upfitters",
    job: "A winch, an inverter, a liftgate, a light bar, a second battery.",
    how: "Size each cable and fuse for the current, the run length and the heat where it is routed, see which limit decided the size, and check that the alternator still keeps up at idle.",
  },
  {
    who: "Instructors",
    job: "Teaching predict, measure, compare, conclude.",
    how: "Build worked circuits with faults placed on purpose, share them with a class, and let students open, explore and copy them into their own work.",
  },
];

const method = [
  { step: "1", title: "Battery first", text: "State of charge at rest. An alternator is not a battery charger." },
  { step: "2", title: "Feeds", text: "Sense and ignition feeds, fuses and fusible links, the B+ connection." },
  { step: "3", title: "Drops under load", text: "Positive side and ground side, with current flowing, joint by joint." },
  { step: "4", title: "Verdict", text: "Condemn a part only once the feeds, grounds and cables are proven." },
];

export default function HomePage() {
  return (
    <div>
      <section className="border-b border-graphite-100 bg-paper-raised">
        <div className="mx-auto grid max-w-7xl items-center gap-10 px-4 py-12 sm:px-6 lg:grid-cols-[1.1fr_1fr] lg:py-16">
          <div>
            <p className="text-sm font-semibold uppercase tracking-wider text-copper-600">Charging and starting circuits</p>
            <h1 className="mt-3 text-4xl font-semibold tracking-tight text-graphite-950 sm:text-5xl" data-testid="landing-title">
              Prove where the fault is before you buy the part.
            </h1>
            <p className="mt-5 max-w-xl text-lg text-graphite-700">
              Ampwright is a workspace for vehicle electrical work. Sketch the circuit, let it compute every voltage,
              current and drop in each operating state, lay your meter readings over it, and find the high-resistance
              joint. Size cables and fuses for added loads. Teach the method with circuits a class can open.
            </p>
            <div className="mt-8 flex flex-wrap gap-3">
              <Link href="/jobs" className="rounded-md bg-copper-600 px-5 py-3 font-semibold text-white shadow-sm hover:bg-copper-700">
                Open the jobs
              </Link>
              <Link href="/size" className="rounded-md border border-graphite-300 bg-white px-5 py-3 font-semibold text-graphite-900 hover:border-graphite-500">
                Size a cable
              </Link>
            </div>
          </div>
          <div className="mx-auto w-full max-w-md lg:max-w-none">
            <DropIllustration />
          </div>
        </div>
      </section>

      <section className="mx-auto max-w-7xl px-4 pt-12 sm:px-6" aria-labelledby="check-heading">
        <h2 id="check-heading" className="text-2xl font-semibold tracking-tight">What should a healthy cranking circuit read?</h2>
        <p className="mt-2 max-w-3xl text-graphite-700">
          A free check, no account needed: the battery, its two cables and the joints at each end, solved the way the full workspace solves a
          whole vehicle.
        </p>
        <div className="mt-6">
          <QuickCheck />
        </div>
      </section>

      <section className="mx-auto max-w-7xl px-4 py-12 sm:px-6" aria-labelledby="who-heading">
        <h2 id="who-heading" className="text-2xl font-semibold tracking-tight">Who it is for</h2>
        <div className="mt-6 grid gap-5 md:grid-cols-3">
          {audiences.map((a) => (
            <article key={a.who} className="rounded-lg border border-graphite-100 bg-paper-raised p-5">
              <h3 className="text-lg font-semibold">{a.who}</h3>
              <p className="mt-1 text-sm font-medium text-copper-700">{a.job}</p>
              <p className="mt-3 text-graphite-700">{a.how}</p>
            </article>
          ))}
        </div>
      </section>

      <section className="bg-graphite-900 text-graphite-100" aria-labelledby="method-heading">
        <div className="mx-auto max-w-7xl px-4 py-12 sm:px-6">
          <h2 id="method-heading" className="text-2xl font-semibold tracking-tight text-white">The order that finds it</h2>
          <ol className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            {method.map((m) => (
              <li key={m.step} className="rounded-lg border border-graphite-700 bg-graphite-800 p-5">
                <span className="font-mono text-sm text-copper-500">Step {m.step}</span>
                <p className="mt-1 font-semibold text-white">{m.title}</p>
                <p className="mt-2 text-sm text-graphite-300">{m.text}</p>
              </li>
            ))}
          </ol>
        </div>
      </section>

      <section className="mx-auto max-w-7xl px-4 py-12 sm:px-6" aria-labelledby="areas-heading">
        <h2 id="areas-heading" className="text-2xl font-semibold tracking-tight">Where things are</h2>
        <ul className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
          {areas.map((a) => (
            <li key={a.href}>
              <Link href={a.href} className="block h-full rounded-lg border border-graphite-100 bg-paper-raised p-4 hover:border-copper-500">
                <span className="font-semibold">{a.label}</span>
                <span className="mt-1 block text-sm text-graphite-700">{a.summary}</span>
              </Link>
            </li>
          ))}
        </ul>
        <div className="mt-10">
          <SafetyNote compact />
        </div>
      </section>
    </div>
  );
}

// Landing page: what Plumbline does, for whom, and the way in.
import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { Caution } from "@/components/ui/banner";
import { Wordmark } from "@/components/ui/plumb-mark";
import { PlumbTrace } from "@/components/marketing/plumb-trace";

const measures = [
  { name: "Bar path", detail: "Drift from the vertical through the start point, at the worst moment and at lockout." },
  { name: "Bar speed", detail: "Mean and peak concentric velocity per rep, and the speed lost across the set." },
  { name: "Joint angles", detail: "Knee, hip and torso at the start, the bottom and lockout, from a side view." },
  { name: "Reps and phases", detail: "Each rep found and split into lowering, pause and drive, with their times." },
];

const steps = [
  { title: "Film the set", body: "A phone on a tripod, side on, whole body and bar in frame. Upload the clip or record it in the browser." },
  { title: "Measure in the browser", body: "Pose and bar tracking run on the athlete's own device; the measures of every rep are saved with the set." },
  { title: "Review and compare", body: "The coach marks the clip up, answers with cues and drills, and compares reps and weeks side by side." },
];

export default function LandingPage() {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="mx-auto flex w-full max-w-page items-center justify-between gap-4 px-gutter py-4 sm:px-gutter-wide">
        <Link href="/" aria-label="Plumbline home">
          <Wordmark />
        </Link>
        <nav className="flex items-center gap-2">
          <ButtonLink href="/sign-in" variant="quiet">
            Sign in
          </ButtonLink>
          <ButtonLink href="/sign-up">
            Start a team
          </ButtonLink>
        </nav>
      </header>

      <main className="mx-auto grid w-full max-w-page flex-1 gap-12 px-gutter pb-16 pt-8 sm:px-gutter-wide sm:pt-14">
        <section className="grid items-center gap-10 md:grid-cols-[1fr_auto]">
          <div className="max-w-prose">
            <p className="text-sm font-medium text-action">Video form review for strength coaches</p>
            <h1 className="mt-2 text-3xl font-semibold tracking-tight text-balance sm:text-4xl">
              Hang a plumb line on every rep.
            </h1>
            <p className="mt-4 text-base text-ink-muted">
              Plumbline turns a phone video of a squat, bench press or deadlift into bar path, joint angles, rep phases
              and bar speed. Coaches mark the clip up and answer; every rep&apos;s measures are kept, so technique and
              speed can be compared rep to rep and week to week.
            </p>
            <div className="mt-6 flex flex-wrap gap-3">
              <ButtonLink href="/sign-up" size="lg">
                Start a team
              </ButtonLink>
              <ButtonLink href="/sign-in" size="lg" variant="secondary">
                Sign in
              </ButtonLink>
            </div>
            <p className="mt-3 text-sm text-ink-muted">Athletes join through their coach&apos;s invitation.</p>
          </div>
          <PlumbTrace className="mx-auto h-56 w-auto sm:h-72" />
        </section>

        <section aria-labelledby="who" className="grid gap-4 md:grid-cols-2">
          <h2 id="who" className="sr-only">
            Who it is for
          </h2>
          <div className="rounded-lg border border-line bg-surface p-5">
            <h3 className="font-semibold">For coaches</h3>
            <p className="mt-2 text-sm text-ink-muted">
              A gym, a club or an online coaching business: invite your athletes, see every set they film, review it
              with drawings and comments, and follow their speed and technique over the weeks.
            </p>
          </div>
          <div className="rounded-lg border border-line bg-surface p-5">
            <h3 className="font-semibold">For athletes</h3>
            <p className="mt-2 text-sm text-ink-muted">
              Film a set on your phone, see what the bar did, and get your coach&apos;s answer on the clip itself. Your
              data stays yours: export it or delete it whenever you like.
            </p>
          </div>
        </section>

        <section aria-labelledby="measures">
          <h2 id="measures" className="text-lg font-semibold">
            What it measures
          </h2>
          <dl className="mt-4 grid gap-x-8 gap-y-4 sm:grid-cols-2">
            {measures.map((measure) => (
              <div key={measure.name} className="border-l-2 border-action pl-3">
                <dt className="font-medium">{measure.name}</dt>
                <dd className="mt-0.5 text-sm text-ink-muted">{measure.detail}</dd>
              </div>
            ))}
          </dl>
        </section>

        <section aria-labelledby="how">
          <h2 id="how" className="text-lg font-semibold">
            How it works
          </h2>
          <ol className="mt-4 grid gap-4 md:grid-cols-3">
            {steps.map((step, index) => (
              <li key={step.title} className="rounded-lg border border-line bg-surface p-5">
                <span className="nums text-sm font-semibold text-action">{index + 1}</span>
                <h3 className="mt-1 font-semibold">{step.title}</h3>
                <p className="mt-1 text-sm text-ink-muted">{step.body}</p>
              </li>
            ))}
          </ol>
        </section>

        <Caution className="max-w-prose" />
      </main>

      <footer className="border-t border-line">
        <div className="mx-auto flex w-full max-w-page flex-wrap items-center justify-between gap-3 px-gutter py-5 text-sm text-ink-muted sm:px-gutter-wide">
          <span>Plumbline</span>
          <span>2-D video cannot see spinal flexion or depth across the camera axis.</span>
        </div>
      </footer>
    </div>
  );
}

import Link from "next/link";
import { Wordmark } from "@/components/brand/logo-mark";
import { SphereIllustration } from "@/components/brand/sphere-illustration";
import { getViewer } from "@/lib/guard";

const CHECKS = [
  ["Coverage", "Equal-area cells over the sphere of field directions, with the largest gap named and the next pose to try."],
  ["Fit", "Hard-iron offset and soft-iron matrix from an ellipsoid fit, with residuals and 95% intervals."],
  ["Reference", "Field strength and inclination against the World Magnetic Model for the site and date."],
  ["Mounting", "The rotation between two compasses, compared with the one each was declared with."],
  ["Current", "Field change per ampere from power wiring, as a share of the Earth's field."],
  ["Gravity", "Six still poses, each near a right angle, fitted against WGS 84 normal gravity."],
];

export default async function HomePage() {
  const viewer = await getViewer();
  return (
    <div className="min-h-screen">
      <header className="mx-auto flex max-w-6xl items-center justify-between px-6 py-6">
        <Wordmark className="text-xl" />
        <nav className="flex items-center gap-3 text-sm">
          {viewer ? (
            <Link href="/workspaces" className="btn-primary">
              Your workspaces
            </Link>
          ) : (
            <>
              <Link href="/sign-in" className="btn-quiet">
                Sign in
              </Link>
              <Link href="/sign-up" className="btn-primary">
                Create an account
              </Link>
            </>
          )}
        </nav>
      </header>
      <main>
        <section className="mx-auto grid max-w-6xl items-center gap-10 px-6 py-16 lg:grid-cols-[1.2fr_1fr]">
          <div className="space-y-6">
            <p className="font-mono text-xs uppercase tracking-[0.2em] text-brass-600 dark:text-brass-300">
              Sensor calibration, checked and kept
            </p>
            <h1 className="text-4xl font-semibold leading-tight sm:text-5xl">Know that a compass is right before the vehicle goes out.</h1>
            <p className="max-w-xl text-lg text-chart-muted">
              Loxodrome takes the samples logged while a vehicle is turned through every orientation, fits its magnetometers and
              accelerometers on the server, tests each result against published references, explains what is wrong and keeps a signed
              history per vehicle.
            </p>
            <div className="flex flex-wrap gap-3">
              <Link href={viewer ? "/workspaces" : "/sign-up"} className="btn-primary">
                {viewer ? "Open Loxodrome" : "Start a workspace"}
              </Link>
              <Link href="/sign-in" className="btn-quiet">
                Try the demo workspace
              </Link>
            </div>
          </div>
          <div className="flex justify-center">
            <SphereIllustration className="h-72 w-72 drop-shadow-xl" />
          </div>
        </section>
        <section className="border-y border-chart-rule bg-chart-sheet">
          <div className="mx-auto grid max-w-6xl gap-6 px-6 py-14 sm:grid-cols-2 lg:grid-cols-3">
            {CHECKS.map(([title, text]) => (
              <div key={title} className="space-y-1">
                <h2 className="text-lg font-semibold">{title}</h2>
                <p className="text-sm text-chart-muted">{text}</p>
              </div>
            ))}
          </div>
        </section>
        <section className="mx-auto max-w-6xl px-6 py-10 text-sm text-chart-muted">
          <p>
            Captures that power motors are made with propellers off, the vehicle restrained, the battery handled as its maker says and
            people clear. Loxodrome defers to local rules (aviation rules where the vehicle flies), the vehicle maker&apos;s manual and
            licensed practice.
          </p>
        </section>
      </main>
    </div>
  );
}

import Link from "next/link";
import { ButtonLink } from "@/components/ui";
import { BandSketch } from "@/components/shell/band-sketch";
import { getCurrentUser } from "@/lib/server/session";

export const dynamic = "force-dynamic";

const steps = [
  {
    title: "Bring your bands",
    body: "Upload DFT band energies along a k-path or ARPES peak positions with error bars, as CSV or TSV. Files are kept byte for byte with their SHA-256.",
  },
  {
    title: "Fit a tight-binding model",
    body: "Start from a template — chains, square and honeycomb lattices, sp³s* and spd Slater–Koster models — choose free parameters, bounds, band mapping and energy window, and run Levenberg–Marquardt in the background.",
  },
  {
    title: "Compare and hand over",
    body: "Every launch is a revision with its data, settings and result. Compare RMS per band and parameters ± standard errors, then export a versioned parameter set with its real-space hoppings.",
  },
];

export default async function LandingPage() {
  const user = await getCurrentUser();
  return (
    <div className="mx-auto max-w-page px-4 py-12">
      <section className="grid items-center gap-10 md:grid-cols-[1fr_minmax(0,26rem)]">
        <div>
          <h1 className="text-3xl leading-tight">Tight-binding models fitted to your band data, with a record of how.</h1>
          <p className="mt-4 max-w-xl text-base text-ink-muted">
            Bandwright fits on-site energies and hopping integrals to band dispersions from DFT or ARPES, reports
            χ², RMS and standard errors for every parameter, and keeps each fit as a revision your team can
            reproduce months later.
          </p>
          <div className="mt-6 flex flex-wrap items-center gap-3">
            {user ? (
              <ButtonLink href="/workspaces">Open your workspaces</ButtonLink>
            ) : (
              <>
                <ButtonLink href="/sign-up">Create an account</ButtonLink>
                <ButtonLink href="/sign-in" variant="secondary">
                  Sign in
                </ButtonLink>
              </>
            )}
          </div>
          <p className="mt-3 text-sm text-ink-faint">
            Invited to a workspace? Open the link in your invitation e-mail, or <Link href="/sign-in">sign in</Link> first.
          </p>
        </div>
        <figure className="rounded-lg border border-line bg-surface p-3 shadow-sm">
          <BandSketch />
          <figcaption className="mt-2 text-xs text-ink-muted">
            Model bands (lines) and data points (circles) along Γ–X–M–Γ of a square lattice.
          </figcaption>
        </figure>
      </section>

      <section aria-labelledby="how-heading" className="mt-14">
        <h2 id="how-heading" className="text-base text-ink-muted">
          How it works
        </h2>
        <ol className="mt-4 grid gap-4 md:grid-cols-3">
          {steps.map((step, i) => (
            <li key={step.title} className="rounded-lg border border-line bg-surface p-4">
              <p className="text-xs font-semibold text-accent-700 tabular-nums">Step {i + 1}</p>
              <h3 className="mt-1 text-base">{step.title}</h3>
              <p className="mt-1.5 text-sm text-ink-muted">{step.body}</p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}

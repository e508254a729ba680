import { Link } from "react-router";
import type { Route } from "./+types/home";
import { EXAMPLE_LAB } from "~/labs/example-lab";

export const meta: Route.MetaFunction = () => [{ title: "Stillpoint — steady states of reaction networks" }];

const EXAMPLE_CSV = `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value
E + S <-> C,binding,kon,koff,2,1
C -> E + P,turnover,kcat,,3,`;

const COMPUTES = [
  {
    title: "Structure",
    text: "Species, complexes, linkage classes, the stoichiometric matrix and its rank, weak and strong reversibility.",
  },
  {
    title: "Conservation laws",
    text: "A basis of linear conserved quantities, such as total enzyme, so you know which totals fix a steady state.",
  },
  {
    title: "Deficiency",
    text: "The deficiency of the network and what the classical deficiency theorems say about it.",
  },
  {
    title: "Steady-state equations",
    text: "The mass-action polynomial system, written out with your rate constants as symbols or numbers.",
  },
  {
    title: "Exact Gröbner bases",
    text: "Lexicographic and elimination-order bases over the rationals, computed exactly, never with rounded numbers.",
  },
  {
    title: "Steady states and stability",
    text: "Parametrisations where they exist, counts of positive steady states, and the stability of each one.",
  },
];

export default function Home() {
  return (
    <div className="space-y-16">
      <section className="grid grid-cols-1 gap-10 md:grid-cols-[1.15fr_1fr] md:items-center">
        <div>
          <p className="text-sm font-semibold uppercase tracking-wide text-accent">For reaction-network modellers</p>
          <h1 className="mt-3 text-3xl font-semibold tracking-tight text-ink">
            Find where your mechanism comes to rest — exactly.
          </h1>
          <p className="mt-5 text-lg text-muted">
            Stillpoint is a shared workspace for biochemists, modellers and lab leads who describe chemical and
            biochemical mechanisms with mass-action kinetics. Upload a network as a table of reactions; Stillpoint
            works out its structure, its conservation laws and its steady states with exact arithmetic, and keeps every
            version and result for your lab.
          </p>
          <div className="mt-8 flex flex-wrap gap-3">
            <Link to="/sign-in" className="btn-primary">
              Sign in with your e-mail
            </Link>
            {/* Signed out, this asks for a sign-in first and then opens the public examples. */}
            <Link to={`/labs/${EXAMPLE_LAB.slug}/networks`} className="btn-quiet">
              See the worked examples
            </Link>
          </div>
        </div>
        <figure className="card">
          <figcaption className="text-sm font-medium text-muted">A network is one reaction per row</figcaption>
          <pre className="mt-3 overflow-x-auto rounded-md bg-sunken p-4 text-xs leading-relaxed text-ink">
            {EXAMPLE_CSV}
          </pre>
          <p className="mt-4 text-sm text-muted">
            For this enzyme mechanism the totals <span className="font-medium text-ink">E + C</span> and{" "}
            <span className="font-medium text-ink">S + C + P</span> never change: these are its two conservation laws.
          </p>
        </figure>
      </section>

      <section aria-labelledby="computes">
        <h2 id="computes" className="text-xl font-semibold tracking-tight">
          What Stillpoint computes
        </h2>
        <ul className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {COMPUTES.map((item) => (
            <li key={item.title} className="card">
              <h3 className="font-semibold text-ink">{item.title}</h3>
              <p className="mt-2 text-sm text-muted">{item.text}</p>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="how" className="grid grid-cols-1 gap-6 md:grid-cols-3">
        <h2 id="how" className="sr-only">
          How it works
        </h2>
        {[
          ["1", "Upload", "Write your reactions in a spreadsheet and save it as CSV. Each upload becomes a new, immutable version."],
          ["2", "Analyse", "Choose what to compute. Long computations run in the background and report their progress."],
          ["3", "Share", "Owners invite colleagues as editors or viewers; everyone in the lab sees the same versions and results."],
        ].map(([n, title, text]) => (
          <div key={n} className="flex gap-4">
            <span className="grid size-9 shrink-0 place-items-center rounded-pill bg-accent-soft font-semibold text-accent-strong">
              {n}
            </span>
            <div>
              <h3 className="font-semibold">{title}</h3>
              <p className="mt-1 text-sm text-muted">{text}</p>
            </div>
          </div>
        ))}
      </section>
    </div>
  );
}

import { Form, Link } from "react-router";
import type { PublicLab } from "./labs.server";

/**
 * The short path for someone with no networks yet: read a worked example, get networks of their
 * own (copy the examples or upload), run a steady-state analysis, share the result.
 */
export function FirstSteps({ examples, workingLab }: { examples: PublicLab | null; workingLab: { slug: string; name: string } | null }) {
  const step = "relative rounded-md border border-line bg-surface p-4 pl-12";
  const number = "absolute left-4 top-4 flex h-6 w-6 items-center justify-center rounded-full bg-accent text-xs font-semibold text-accent-ink";
  return (
    <section aria-labelledby="first-steps-title" className="card space-y-4" data-testid="first-steps">
      <div>
        <h2 id="first-steps-title" className="text-lg font-semibold tracking-tight">
          First steps
        </h2>
        <p className="mt-1 text-sm text-muted">Four steps from nothing to a result you can send to a colleague.</p>
      </div>
      <ol className="grid gap-3 md:grid-cols-2">
        <li className={step}>
          <span className={number}>1</span>
          <h3 className="font-medium">Read a worked example</h3>
          <p className="mt-1 text-sm text-muted">
            Finished networks with their structure, conservation laws and what they can do, open to everyone signed in (read only).
          </p>
          {examples ? (
            <Link to={`/labs/${examples.slug}/networks`} className="mt-2 inline-block text-sm font-medium text-accent-strong hover:underline" data-testid="first-steps-examples">
              Open the {examples.networkCount} worked examples →
            </Link>
          ) : (
            <p className="mt-2 text-sm text-faint">No worked examples are installed on this server.</p>
          )}
        </li>
        <li className={step}>
          <span className={number}>2</span>
          <h3 className="font-medium">Upload a network</h3>
          <p className="mt-1 text-sm text-muted">
            A CSV file with one reaction per row, an SBML file, or reactions typed into the table.
            {workingLab ? "" : " Networks live in a lab: create one below, or copy the examples and one is made for you."}
          </p>
          <div className="mt-2 flex flex-wrap items-center gap-3 text-sm">
            {workingLab && (
              <Link to={`/labs/${workingLab.slug}/networks/new`} className="font-medium text-accent-strong hover:underline">
                New network in {workingLab.name} →
              </Link>
            )}
            {examples && <CopyExamplesButton from={examples.slug} />}
          </div>
        </li>
        <li className={step}>
          <span className={number}>3</span>
          <h3 className="font-medium">Run a steady-state analysis</h3>
          <p className="mt-1 text-sm text-muted">
            On a network of your lab, “Start analysis” finds the positive steady states, their stability and robust species, in the background.
          </p>
        </li>
        <li className={step}>
          <span className={number}>4</span>
          <h3 className="font-medium">Share it</h3>
          <p className="mt-1 text-sm text-muted">
            Invite colleagues to the lab by e-mail, or give a finished analysis a read-only link with “Share outside the lab”.
          </p>
        </li>
      </ol>
    </section>
  );
}

/** Posts to /labs: copies the public examples into the working lab (or a new lab of one's own). */
export function CopyExamplesButton({ from, to }: { from: string; to?: string }) {
  return (
    <Form method="post" action="/labs">
      <input type="hidden" name="intent" value="copy-examples" />
      <input type="hidden" name="from" value={from} />
      {to && <input type="hidden" name="to" value={to} />}
      <button type="submit" className="btn-quiet py-1 text-sm" data-testid="copy-examples">
        Copy these examples into my lab
      </button>
    </Form>
  );
}

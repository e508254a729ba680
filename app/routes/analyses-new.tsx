import { Form, Link, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/analyses-new";
import { db } from "~/db.server";
import { analysisInputFromForm } from "~/analyses/form.server";
import { suggestedOrder } from "~/analyses/suggested-order";
import { fileRateValues, rateSymbols } from "~/analyses/params";
import { analysisPath } from "~/analyses/paths";
import { labLimits } from "~/analyses/repository.server";
import { networkOf, startAnalysis } from "~/analyses/service.server";
import { OrderEditor } from "~/analyses/ui/order-editor";
import { Problems } from "~/analyses/ui/problems";
import { requireNetwork, requireVersion } from "~/networks/pages.server";
import { structureState } from "~/networks/structure-store.server";
import { StructurePending } from "~/networks/ui/structure-pending";
import { networkPath } from "~/networks/paths";
import { requireLabRole } from "~/permissions/permissions.server";
import { formatRational } from "@domain/algebra/rational";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `New analysis of ${data?.network.name ?? "a network"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  const network = await requireNetwork(db(), access, params.networkId);
  const version = await requireVersion(db(), network, new URL(request.url).searchParams.get("v"));
  const parsed = networkOf(version.csv);
  // The suggestion needs the conservation laws: from the stored structure, never computed here.
  const state = await structureState(db(), version.csv);
  const suggestion = state.status === "ready" ? suggestedOrder(parsed, state.structure.conservationLaws) : { order: [...parsed.species], reason: "" };
  return {
    structureStatus: state.status,
    structureProblem: state.status === "failed" ? state.message : undefined,
    lab: access.lab,
    network: { id: network.id, name: network.name },
    version: { number: version.number },
    species: [...parsed.species],
    rates: rateSymbols(parsed),
    fileValues: fileRateValues(parsed),
    // The version's stored initial values (`# initial:`) fill the fields; the person can change or clear them.
    storedInitial: Object.fromEntries((parsed.initial ?? []).map((i) => [i.name, formatRational(i.value)])),
    suggested: suggestion.order,
    reason: suggestion.reason,
    limits: await labLimits(db(), access.lab.id),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  const network = await requireNetwork(db(), access, params.networkId);
  const version = await requireVersion(db(), network, new URL(request.url).searchParams.get("v"));
  const outcome = await startAnalysis(db(), access, version, analysisInputFromForm(await request.formData()));
  if (!outcome.ok) return { problems: outcome.problems };
  throw redirect(analysisPath(access.lab.slug, outcome.job.id));
}

const input = "rounded-md border border-line bg-surface px-2 py-1 text-sm";

export default function NewAnalysis({ loaderData: d, actionData }: Route.ComponentProps) {
  const busy = useNavigation().state !== "idle";
  const allValued = d.rates.every((r) => r in d.fileValues);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p className="text-sm text-muted">
          <Link to={networkPath(d.lab.slug, d.network.id)} className="text-accent-strong hover:underline">
            {d.network.name}
          </Link>{" "}
          · version {d.version.number}
        </p>
        <h1 className="text-2xl font-semibold tracking-tight">New steady-state analysis</h1>
        <p className="max-w-prose text-sm text-muted">
          A worker computes in the background; you can leave this page. Results are pinned to version {d.version.number} of the network and to the
          engine version that computed them.
        </p>
      </header>
      {actionData?.problems && <Problems problems={actionData.problems} />}
      {d.structureStatus !== "ready" ? (
        // The form suggests an order from the conservation laws, which the worker is still computing.
        <StructurePending status={d.structureStatus === "failed" ? "failed" : "pending"} problem={d.structureProblem} what="The structure this form needs" />
      ) : (
        <Form method="post" className="grid grid-cols-1 gap-8 lg:grid-cols-2">
          <fieldset className="space-y-3">
            <legend className="mb-2 font-semibold">Elimination order</legend>
            <OrderEditor suggested={d.suggested} reason={d.reason} />
            <div className="space-y-1 text-sm">
              <p className="font-medium">Species kept free (moved to the end of the order)</p>
              <div className="flex flex-wrap gap-3">
                {d.species.map((s) => (
                  <label key={s} className="inline-flex items-center gap-1 font-mono">
                    <input type="checkbox" name="free" value={s} /> {s}
                  </label>
                ))}
              </div>
            </div>
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-2 font-semibold">Rate constants</legend>
            <div className="flex gap-4 text-sm">
              <label className="inline-flex items-center gap-1">
                <input type="radio" name="rateMode" value="numeric" defaultChecked={allValued} /> numeric values
              </label>
              <label className="inline-flex items-center gap-1">
                <input type="radio" name="rateMode" value="symbolic" defaultChecked={!allValued} /> all symbolic
              </label>
            </div>
            <div className="grid grid-cols-2 gap-2 sm:grid-cols-3">
              {d.rates.map((r) => (
                <label key={r} className="space-y-0.5 text-sm">
                  <span className="block font-mono">{r}</span>
                  <input className={`${input} w-full`} name={`rate.${r}`} placeholder={d.fileValues[r] ?? "value"} aria-label={`Value of ${r}`} />
                </label>
              ))}
            </div>
            <p className="text-xs text-muted">Empty fields keep the value from the network file (shown greyed). Decimals and fractions are read exactly.</p>
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-2 font-semibold">Initial concentrations (for numeric steady states)</legend>
            <div className="grid grid-cols-2 gap-2 sm:grid-cols-3">
              {d.species.map((s) => (
                <label key={s} className="space-y-0.5 text-sm">
                  <span className="block font-mono">{s}</span>
                  <input className={`${input} w-full`} name={`initial.${s}`} placeholder="0" defaultValue={d.storedInitial[s] ?? ""} aria-label={`Initial concentration of ${s}`} />
                </label>
              ))}
            </div>
            <p className="text-xs text-muted">
              {Object.keys(d.storedInitial).length > 0 ? "Filled in from the values stored with this version; change them here for this analysis only. " : ""}
              Leave all empty for a symbolic analysis only. Unlisted species start at 0; the totals of the conservation laws follow.
            </p>
          </fieldset>
          <fieldset className="space-y-3">
            <legend className="mb-2 font-semibold">Limits</legend>
            <label className="block space-y-0.5 text-sm">
              <span className="block">Time limit (seconds, at most {d.limits.maxTimeLimitSeconds} in this lab)</span>
              <input className={input} name="timeLimitSeconds" type="number" min={1} max={d.limits.maxTimeLimitSeconds} defaultValue={Math.min(120, d.limits.maxTimeLimitSeconds)} />
            </label>
            <label className="block space-y-0.5 text-sm">
              <span className="block">Size budget: largest Gröbner basis (polynomials, at most {d.limits.maxBasisSize})</span>
              <input className={input} name="maxBasisSize" type="number" min={1} max={d.limits.maxBasisSize} defaultValue={Math.min(2000, d.limits.maxBasisSize)} />
            </label>
            <label className="inline-flex items-center gap-2 text-sm">
              <input type="checkbox" name="notify" /> E-mail me when it finishes or fails
            </label>
          </fieldset>
          <div className="lg:col-span-2">
            <button type="submit" disabled={busy} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink hover:bg-accent-strong disabled:opacity-60">
              {busy ? "Starting…" : "Start analysis"}
            </button>
          </div>
        </Form>
      )}
    </div>
  );
}

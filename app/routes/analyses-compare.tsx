import { Link } from "react-router";
import type { Route } from "./+types/analyses-compare";
import { db } from "~/db.server";
import { analysisPath } from "~/analyses/paths";
import { findJob, jobJson } from "~/analyses/repository.server";
import type { AnalysisParams } from "~/analyses/params";
import { presentResult } from "~/analyses/present";
import type { AnalysisResult } from "~/analyses/result-types";
import { Formula } from "~/analyses/ui/tex";
import { requireLabRole } from "~/permissions/permissions.server";
import { notFound } from "~/shared/responses";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Compare analyses · Stillpoint" }];

export const MAX_COMPARED = 6;

/** ?id=<id>&id=<id>…: two to six finished analyses of one network side by side (?a=&b= still works). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const url = new URL(request.url);
  const adb = db();
  const ids = [...new Set([...url.searchParams.getAll("id"), ...url.searchParams.getAll("a"), ...url.searchParams.getAll("b")].filter(Boolean))];
  if (ids.length < 2 || ids.length > MAX_COMPARED) throw new Response(`Choose two to ${MAX_COMPARED} analyses to compare (${ids.length} given).`, { status: 400 });
  const jobs = await Promise.all(ids.map((id) => findJob(adb, access.lab.id, id)));
  if (jobs.some((j) => !j || j.kind !== "analysis")) throw notFound();
  const found = jobs as NonNullable<(typeof jobs)[number]>[];
  if (new Set(found.map((j) => j.network_id)).size > 1) throw new Response("Only analyses of the same network can be compared.", { status: 400 });
  // Oldest first, so the columns read as a history.
  found.sort((x, y) => x.created_at.getTime() - y.created_at.getTime());
  const side = (j: (typeof found)[number]) => {
    const result = j.status === "succeeded" ? (j.result as unknown as AnalysisResult) : null;
    return { job: jobJson(j), params: j.params as unknown as AnalysisParams, result, view: result ? presentResult(result, j.params as unknown as AnalysisParams) : null };
  };
  return { lab: access.lab, sides: found.map(side) };
}

type Side = Route.ComponentProps["loaderData"]["sides"][number];

function Column({ s, labSlug }: { s: Side; labSlug: string }) {
  const r = s.result;
  return (
    <div className="min-w-0 space-y-3 rounded-card border border-line bg-surface p-4" data-testid="compare-column">
      <p className="text-sm">
        <Link to={analysisPath(labSlug, s.job.id)} className="font-medium text-accent-strong hover:underline">
          {s.job.name || formatDateTime(s.job.createdAt)}
        </Link>{" "}
        {s.job.name && <span className="text-muted">{formatDateTime(s.job.createdAt)} </span>}
        · version {s.job.network.version} · engine {s.job.engineVersion}
      </p>
      <p className="text-sm text-muted">
        {s.params.rateMode} rates; order {r?.order.species.join(" > ") ?? s.params.order?.join(" > ") ?? "suggested"}
        {s.params.initial ? `; initial ${Object.entries(s.params.initial).map(([k, v]) => `${k}=${v}`).join(", ")}` : ""}
      </p>
      {!r || !s.view ? (
        <p className="text-sm text-muted">No result ({s.job.status}).</p>
      ) : (
        <>
          <h3 className="font-semibold">Parametrisation</h3>
          {s.view.parametrisation ? s.view.parametrisation.rows.map((row) => <div key={row.species}><Formula tex={row.tex} text={`${row.species} = ${row.expression}`} /></div>) : <p className="text-sm text-muted">none</p>}
          <h3 className="font-semibold">Triangular system</h3>
          <p className="text-sm">{r.groebnerBasisComplete ? `${r.groebnerBasis.length} polynomials` : r.groebnerBasisStatus === "skipped" ? "not computed (the parametrisation answers)" : "not finished"}</p>
          <h3 className="font-semibold">ACR</h3>
          <p className="text-sm">{r.acr.length === 0 ? "none" : r.acr.map((x) => `${x.species} = ${x.value}`).join("; ")}</p>
          <h3 className="font-semibold">Positive steady states</h3>
          {r.steadyStates ? (
            <ul className="text-sm tabular-nums">
              {r.steadyStates.map((st, i) => (
                <li key={i}>
                  {st.verdict}: {Object.entries(st.concentrations).map(([k, v]) => `${k}=${v.toPrecision(6)}`).join(", ")}
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-muted">not computed (no initial concentrations)</p>
          )}
        </>
      )}
    </div>
  );
}

export default function Compare({ loaderData: d }: Route.ComponentProps) {
  const n = d.sides.length;
  // Two side by side from medium screens; more wrap into up to three columns, then scroll sideways.
  const grid = n === 2 ? "md:grid-cols-2" : "md:grid-cols-2 xl:grid-cols-3";
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold tracking-tight">
        Compare {n === 2 ? "two" : n} analyses of {d.sides[0]!.job.network.name}
      </h1>
      <div className={`grid gap-4 ${grid}`}>
        {d.sides.map((s) => (
          <Column key={s.job.id} s={s} labSlug={d.lab.slug} />
        ))}
      </div>
    </div>
  );
}

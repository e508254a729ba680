import { Form, Link, data } from "react-router";
import type { Route } from "./+types/analyses";
import { db } from "~/db.server";
import { analysisPath } from "~/analyses/paths";
import { jobJson, labLimits, listJobs, setLabLimits } from "~/analyses/repository.server";
import { SITE_LIMITS } from "~/analyses/params";
import { recordAnalysisAudit } from "~/analyses/service.server";
import { StatusBadge } from "~/analyses/ui/status";
import { networkPath } from "~/networks/paths";
import { assertLabRole, requireLabRole } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Analyses · Stillpoint" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const jobs = await listJobs(adb, access.lab.id, { kind: "analysis" });
  return { lab: access.lab, analyses: jobs.map((j) => jobJson(j)), isOwner: hasRole(access.role, "owner"), limits: await labLimits(adb, access.lab.id) };
}

/** Owners set the lab's maximum time limit and size budget. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  assertLabRole(access, "owner");
  const form = await request.formData();
  const maxTimeLimitSeconds = Number(form.get("maxTimeLimitSeconds"));
  const maxBasisSize = Number(form.get("maxBasisSize"));
  const problems = [];
  const siteMax = SITE_LIMITS.maxTimeLimitSeconds;
  if (!Number.isInteger(maxTimeLimitSeconds) || maxTimeLimitSeconds < 1 || maxTimeLimitSeconds > siteMax) problems.push({ field: "maxTimeLimitSeconds", message: `expected 1 to ${siteMax} seconds (the site's maximum)` });
  if (!Number.isInteger(maxBasisSize) || maxBasisSize < 1 || maxBasisSize > 1_000_000) problems.push({ field: "maxBasisSize", message: "expected 1 to 1000000" });
  if (problems.length > 0) return data({ problems }, { status: 400 });
  await setLabLimits(db(), access.lab.id, { maxTimeLimitSeconds, maxBasisSize });
  await recordAnalysisAudit(db(), access.lab.id, access.user.id, "analysis.limits_changed", { maxTimeLimitSeconds, maxBasisSize });
  return { saved: true };
}

export default function Analyses({ loaderData: d, actionData }: Route.ComponentProps) {
  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Analyses of {d.lab.name}</h1>
        <p className="text-sm text-muted">Start one from a network's page. Every member of the lab sees these; editors start and cancel them.</p>
      </header>
      <div className="overflow-x-auto rounded-card border border-line bg-surface">
        <table className="w-full text-left text-sm" data-testid="analyses-table">
          <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
            <tr>
              <th className="px-4 py-2">Network</th>
              <th className="px-4 py-2">Status</th>
              <th className="px-4 py-2">Settings</th>
              <th className="px-4 py-2">Started</th>
              <th className="px-4 py-2">By</th>
            </tr>
          </thead>
          <tbody>
            {d.analyses.map((a) => {
              const p = a.params as { rateMode?: string; initial?: Record<string, string> | null };
              return (
                <tr key={a.id} className="border-b border-line last:border-0" data-testid="analysis-row">
                  <td className="px-4 py-2">
                    <Link to={analysisPath(d.lab.slug, a.id)} className="font-medium text-accent-strong hover:underline">
                      {a.network.name}
                    </Link>{" "}
                    <Link to={networkPath(d.lab.slug, a.network.id)} className="text-xs text-muted hover:underline">
                      v{a.network.version}
                    </Link>
                  </td>
                  <td className="px-4 py-2">
                    <StatusBadge status={a.status} />
                  </td>
                  <td className="px-4 py-2 text-muted">
                    {p.rateMode} rates{p.initial ? ", numeric steady states" : ""}
                  </td>
                  <td className="whitespace-nowrap px-4 py-2 text-muted">{formatDateTime(a.createdAt)}</td>
                  <td className="px-4 py-2 text-muted">{a.startedBy ?? "former member"}</td>
                </tr>
              );
            })}
            {d.analyses.length === 0 && (
              <tr>
                <td colSpan={5} className="px-4 py-6 text-center text-muted">
                  No analyses yet. Open a network and choose “Start analysis”.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
      <section className="space-y-2 text-sm">
        <h2 className="font-semibold">Limits in this lab</h2>
        <p className="text-muted">
          Longest time limit an analysis may ask for: {d.limits.maxTimeLimitSeconds} s; largest Gröbner basis: {d.limits.maxBasisSize} polynomials.
        </p>
        {d.isOwner && (
          <Form method="post" className="flex flex-wrap items-end gap-3">
            <label className="space-y-0.5">
              <span className="block">Maximum time limit (s)</span>
              <input name="maxTimeLimitSeconds" type="number" min={1} max={SITE_LIMITS.maxTimeLimitSeconds} defaultValue={d.limits.maxTimeLimitSeconds} className="w-28 rounded-md border border-line bg-surface px-2 py-1" />
            </label>
            <label className="space-y-0.5">
              <span className="block">Maximum basis size</span>
              <input name="maxBasisSize" type="number" min={1} defaultValue={d.limits.maxBasisSize} className="w-28 rounded-md border border-line bg-surface px-2 py-1" />
            </label>
            <button className="rounded-md border border-accent px-3 py-1.5 font-medium text-accent-strong hover:bg-accent-soft">Save limits</button>
            {actionData && "saved" in actionData && <span className="text-ok">Saved.</span>}
            {actionData && "problems" in actionData && <span className="text-danger">{actionData.problems.map((p) => p.message).join("; ")}</span>}
          </Form>
        )}
      </section>
    </div>
  );
}

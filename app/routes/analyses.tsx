import { Form, data } from "react-router";
import type { Route } from "./+types/analyses";
import { db } from "~/db.server";
import { analysisPath } from "~/analyses/paths";
import { jobJson, labLimits, setLabLimits } from "~/analyses/repository.server";
import { listRuns, parseRunFilter, RUN_KINDS, runFilterChoices } from "~/analyses/runs.server";
import { ANALYSIS_STATUSES } from "~/db/schema";
import { SITE_LIMITS } from "~/analyses/params";
import { recordRunAudit } from "~/analyses/audit.server";
import { RunsList } from "~/analyses/ui/runs-list";
import { assertLabRole, requireLabRole } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Analyses · Stillpoint" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const filter = parseRunFilter(new URL(request.url).searchParams);
  const [runs, choices, limits] = await Promise.all([listRuns(adb, access.lab.id, filter), runFilterChoices(adb, access.lab.id), labLimits(adb, access.lab.id)]);
  return {
    lab: access.lab,
    analyses: runs.map((j) => ({ ...jobJson(j), partial: j.status !== "succeeded" && j.partial_result !== null })),
    choices: { ...choices, kinds: RUN_KINDS, statuses: ANALYSIS_STATUSES },
    kindLabels: Object.fromEntries(RUN_KINDS.map((k) => [k.value, k.label])),
    isOwner: hasRole(access.role, "owner"),
    limits,
  };
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
  await recordRunAudit(db(), access, "analysis.limits_changed", { maxTimeLimitSeconds, maxBasisSize });
  return { saved: true };
}

export default function Analyses({ loaderData: d, actionData }: Route.ComponentProps) {
  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Analyses of {d.lab.name}</h1>
        <p className="text-sm text-muted">Start one from a network's page. Every member of the lab sees these; editors start, cancel, name and archive them; owners delete them.</p>
      </header>
      <RunsList labSlug={d.lab.slug} runs={d.analyses} choices={d.choices} kindLabels={d.kindLabels} />
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

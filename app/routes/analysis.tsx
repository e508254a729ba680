import { Link, redirect } from "react-router";
import type { Route } from "./+types/analysis";
import { db } from "~/db.server";
import { runAnalysisAction } from "~/analyses/actions.server";
import { analysisPageData } from "~/analyses/page.server";
import { analysesPath, analysisPath, newAnalysisPath } from "~/analyses/paths";
import { findJob, listJobs } from "~/analyses/repository.server";
import { listShareLinks } from "~/analyses/share.server";
import { AnalysisBody } from "~/analyses/ui/analysis-body";
import { RunDetails } from "~/analyses/ui/run-details";
import { SharePanel } from "~/analyses/ui/share-panel";
import { isUnfinished } from "~/analyses/ui/status";
import { usePolling } from "~/analyses/ui/use-polling";
import { networkPath } from "~/networks/paths";
import { requireLabRole } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { isUuid } from "~/shared/uuid";
import { notFound } from "~/shared/responses";
import { formObject } from "~/shared/form";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Analysis of ${data?.page.job.network.name ?? "a network"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const job = await findJob(adb, access.lab.id, params.analysisId);
  if (!job) throw notFound();
  if (job.parent_id) throw redirect(analysisPath(access.lab.slug, job.parent_id));
  const isOwner = hasRole(access.role, "owner");
  const siblings = (await listJobs(adb, access.lab.id, { kind: "analysis", networkId: job.network_id, limit: 50 })).filter((j) => j.id !== job.id && j.status === "succeeded");
  return {
    lab: access.lab,
    page: await analysisPageData(adb, job, { sharedView: false }),
    canEdit: hasRole(access.role, "editor"),
    isOwner,
    shareLinks: isOwner ? await listShareLinks(adb, job.id) : [],
    compareWith: siblings.map((s) => ({ id: s.id, label: `${s.name ? `${s.name} · ` : ""}${formatDateTime(s.created_at)} · v${s.version_number} · ${s.starter_name ?? "?"}` })),
  };
}

/** Intents, validation and audit entries live in ~/analyses/actions.server; here only who is asking and which run. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const job = await findJob(adb, access.lab.id, params.analysisId);
  if (!job || job.parent_id) throw notFound();
  return runAnalysisAction(adb, access, job, await request.formData());
}

export default function AnalysisPage({ loaderData: d }: Route.ComponentProps) {
  const p = d.page;
  const unfinished = [p.job, ...p.relations, ...p.scans, ...p.timeCourses].some((j) => isUnfinished(j.status));
  usePolling(unfinished);
  const base = analysisPath(d.lab.slug, p.job.id);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p className="text-sm text-muted">
          <Link to={analysesPath(d.lab.slug)} className="text-accent-strong hover:underline">
            Analyses
          </Link>{" "}
          ·{" "}
          <Link to={`${networkPath(d.lab.slug, p.job.network.id)}?v=${p.job.network.version}`} className="text-accent-strong hover:underline">
            {p.job.network.name}
          </Link>
        </p>
        <h1 className="text-2xl font-semibold tracking-tight" data-testid="run-title">
          {p.job.name || "Steady-state analysis"}
        </h1>
        {p.job.name && <p className="text-sm text-muted">Steady-state analysis</p>}
        {p.job.archived && <p className="text-sm text-muted" data-testid="archived-note">Archived.</p>}
        <p className="text-sm text-muted">
          Started by {p.job.startedBy ?? "a former member"} on {formatDateTime(p.job.createdAt)}
          {d.canEdit && (
            <>
              {" "}
              ·{" "}
              <Link to={newAnalysisPath(d.lab.slug, p.job.network.id, p.job.network.version)} className="text-accent-strong hover:underline">
                new analysis of this version
              </Link>
            </>
          )}
        </p>
        {d.compareWith.length > 0 && p.job.status === "succeeded" && (
          <form method="get" action={`${analysesPath(d.lab.slug)}/compare`} className="flex flex-wrap items-end gap-2 text-sm" data-testid="compare-form">
            <input type="hidden" name="id" value={p.job.id} />
            <label>
              <span className="block text-xs text-muted">Compare with (choose one or more; Ctrl or ⌘ for several)</span>
              <select name="id" multiple size={Math.min(4, d.compareWith.length)} className="min-w-64 rounded-md border border-line bg-surface px-2 py-1">
                {d.compareWith.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.label}
                  </option>
                ))}
              </select>
            </label>
            <button className="text-accent-strong hover:underline">Compare</button>
          </form>
        )}
      </header>
      <RunDetails name={p.job.name} note={p.job.note} archived={p.job.archived} canEdit={d.canEdit} canDelete={d.isOwner} busy={unfinished} />
      <AnalysisBody d={p} canEdit={d.canEdit} exportBase={`${base}/export`} scanCsvBase={`${base}/export`} />
      {d.isOwner && (
        <section className="space-y-3 border-t border-line pt-5" aria-labelledby="share-title">
          <h2 id="share-title" className="text-lg font-semibold tracking-tight">
            Share outside the lab
          </h2>
          <p className="max-w-prose text-sm text-muted">A read-only link to this analysis and its finished scans, tests and time courses. Anyone with the link can read it until it expires or you revoke it.</p>
          <SharePanel links={d.shareLinks} />
        </section>
      )}
    </div>
  );
}

import { Link, data, redirect } from "react-router";
import type { Route } from "./+types/analysis";
import { db } from "~/db.server";
import { analysisPageData } from "~/analyses/page.server";
import { analysesPath, analysisPath, newAnalysisPath, sharePath } from "~/analyses/paths";
import { findJob, listJobs } from "~/analyses/repository.server";
import { cancelJob, recordAnalysisAudit, startFollowUp } from "~/analyses/service.server";
import { createShareLink, listShareLinks, revokeShareLink, SHARE_DAYS } from "~/analyses/share.server";
import { AnalysisBody } from "~/analyses/ui/analysis-body";
import { SharePanel } from "~/analyses/ui/share-panel";
import { isUnfinished } from "~/analyses/ui/status";
import { usePolling } from "~/analyses/ui/use-polling";
import { getEnv } from "~/env.server";
import { networkPath } from "~/networks/paths";
import { assertLabRole, requireLabRole } from "~/permissions/permissions.server";
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
    compareWith: siblings.map((s) => ({ id: s.id, label: `${formatDateTime(s.created_at)} · v${s.version_number} · ${s.starter_name ?? "?"}` })),
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const adb = db();
  const job = await findJob(adb, access.lab.id, params.analysisId);
  if (!job || job.parent_id) throw notFound();
  const form = await request.formData();
  const intent = String(form.get("intent") ?? "");
  switch (intent) {
    case "cancel": {
      assertLabRole(access, "editor");
      const target = String(form.get("jobId") ?? job.id);
      const victim = target === job.id ? job : (await findJob(adb, access.lab.id, target));
      if (!victim || (victim.id !== job.id && victim.parent_id !== job.id)) throw notFound();
      return { status: await cancelJob(adb, victim) };
    }
    case "relation":
    case "scan":
    case "timecourse": {
      assertLabRole(access, "editor");
      const input = formObject(form);
      if (intent === "scan") {
        const [kind, name] = String(form.get("parameterChoice") ?? "").split(":");
        Object.assign(input, { parameterKind: kind, parameter: name });
      }
      const outcome = await startFollowUp(adb, access, job, intent, input);
      if (!outcome.ok) return data({ problems: outcome.problems }, { status: 400 });
      return { started: outcome.job.id };
    }
    case "share-create": {
      assertLabRole(access, "owner");
      const days = Number(form.get("days") || SHARE_DAYS.default);
      if (!Number.isInteger(days) || days < 1 || days > SHARE_DAYS.max) return data({ problems: [{ field: "days", message: `expected 1 to ${SHARE_DAYS.max} days` }] }, { status: 400 });
      const link = await createShareLink(adb, job.id, access.user.id, days);
      await recordAnalysisAudit(adb, access.lab.id, access.user.id, "analysis.share_link_created", { analysisId: job.id, linkId: link.id, days });
      return { shareLink: { url: `${getEnv().appUrl}${sharePath(link.token)}`, expiresAt: link.expiresAt.toISOString() } };
    }
    case "share-revoke": {
      assertLabRole(access, "owner");
      const linkId = String(form.get("linkId") ?? "");
      if (!isUuid(linkId) || !(await revokeShareLink(adb, job.id, linkId))) throw notFound();
      await recordAnalysisAudit(adb, access.lab.id, access.user.id, "analysis.share_link_revoked", { analysisId: job.id, linkId });
      return { revoked: linkId };
    }
    default:
      return data({ problems: [{ field: "intent", message: `unknown action '${intent}'` }] }, { status: 400 });
  }
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
        <h1 className="text-2xl font-semibold tracking-tight">Steady-state analysis</h1>
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
          <form method="get" action={`${analysesPath(d.lab.slug)}/compare`} className="flex items-center gap-2 text-sm">
            <input type="hidden" name="a" value={p.job.id} />
            <label>
              Compare with{" "}
              <select name="b" className="rounded-md border border-line bg-surface px-2 py-1">
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

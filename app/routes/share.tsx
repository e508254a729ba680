import type { Route } from "./+types/share";
import { db } from "~/db.server";
import { analysisPageData } from "~/analyses/page.server";
import { findSharedAnalysis } from "~/analyses/share.server";
import { AnalysisBody } from "~/analyses/ui/analysis-body";
import { isUnfinished } from "~/analyses/ui/status";
import { usePolling } from "~/analyses/ui/use-polling";
import { notFound } from "~/shared/responses";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Shared analysis of ${data?.page.job.network.name ?? "a network"} · Stillpoint` }, { name: "robots", content: "noindex" }];

/** /share/:token — read-only, no sign-in; an unknown, expired or revoked token is a plain 404. */
export async function loader({ params }: Route.LoaderArgs) {
  const adb = db();
  const job = await findSharedAnalysis(adb, params.token);
  if (!job || job.parent_id) throw notFound("This share link does not exist, has expired or was revoked.");
  return { page: await analysisPageData(adb, job, { sharedView: true }), token: params.token };
}

export default function SharedAnalysis({ loaderData: d }: Route.ComponentProps) {
  usePolling(isUnfinished(d.page.job.status), 2000);
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <p className="rounded-md bg-accent-soft px-3 py-2 text-sm text-accent-strong" data-testid="shared-banner">
          A read-only copy shared by a member of the lab. You can read and download it; you cannot change it.
        </p>
        <h1 className="text-2xl font-semibold tracking-tight">Steady-state analysis of {d.page.job.network.name}</h1>
      </header>
      <AnalysisBody d={d.page} canEdit={false} exportBase={`/share/${d.token}/export`} scanCsvBase={`/share/${d.token}/export`} />
    </div>
  );
}

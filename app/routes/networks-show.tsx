import { Link } from "react-router";
import type { Route } from "./+types/networks-show";
import { db } from "~/db.server";
import { runNetworkAction } from "~/networks/actions.server";
import { networkPageData, requireNetwork } from "~/networks/pages.server";
import { networkPath } from "~/networks/paths";
import { analysesPath, newAnalysisPath } from "~/analyses/paths";
import { NetworkHeader } from "~/networks/ui/network-header";
import { NetworkSettings } from "~/networks/ui/network-settings";
import { StructurePending } from "~/networks/ui/structure-pending";
import { AtAGlance, EVIDENCE, OdesSection, StructureView } from "~/networks/ui/structure-view";
import { VerdictCardView } from "~/networks/ui/verdict-card";
import { GuestNotice } from "~/labs/guest-notice";
import { VersionList } from "~/networks/ui/version-list";
import { requireLabRole } from "~/permissions/permissions.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.network.name ?? "Network"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId);
  return networkPageData(db(), access, network, new URL(request.url).searchParams.get("v"));
}

export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId);
  return runNetworkAction(db(), access, network, await request.formData());
}

export default function NetworkPage({ loaderData, actionData }: Route.ComponentProps) {
  const d = loaderData;
  const base = networkPath(d.lab.slug, d.network.id);
  return (
    <div className="space-y-8">
      <NetworkHeader data={d} result={actionData} />
      {!d.guest && (
        <p className="flex flex-wrap gap-4 text-sm">
          {d.canEdit && (
            <Link
              to={newAnalysisPath(d.lab.slug, d.network.id, d.version.number)}
              className="rounded-md bg-accent px-3 py-1.5 font-medium text-accent-ink hover:bg-accent-strong"
              data-testid="start-analysis"
            >
              Start analysis of version {d.version.number}
            </Link>
          )}
          <Link to={analysesPath(d.lab.slug)} className="self-center text-accent-strong hover:underline">
            Analyses of this lab
          </Link>
        </p>
      )}
      {d.guest && <GuestNotice slug={d.lab.slug} />}
      {d.verdict ? (
        <VerdictCardView card={d.verdict} />
      ) : (
        // Every line of the card and all evidence but the rate equations rest on the structure the worker is computing.
        <StructurePending status={d.structureStatus === "failed" ? "failed" : "pending"} problem={d.structureProblem} />
      )}
      <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <aside className="space-y-5 lg:sticky lg:top-4 lg:self-start">
          {d.structure && (
            <div>
              <h2 className="mb-1 text-xs font-semibold uppercase tracking-wide text-faint">At a glance</h2>
              <AtAGlance structure={d.structure} />
            </div>
          )}
          <nav aria-label="Evidence">
            <h2 className="mb-1 text-xs font-semibold uppercase tracking-wide text-faint">Evidence</h2>
            <ol className="flex flex-wrap gap-x-4 gap-y-1 text-sm lg:block lg:space-y-1">
              {EVIDENCE.filter(([id]) => d.structure || id === "odes").map(([id, label]) => (
                <li key={id}>
                  <a href={`#${id}`} className="text-accent-strong hover:underline">
                    {label}
                  </a>
                </li>
              ))}
              <li>
                <a href="#versions-title" className="text-accent-strong hover:underline">
                  Versions
                </a>
              </li>
            </ol>
          </nav>
        </aside>
        <div className="min-w-0 space-y-8">
          {d.structure ? <StructureView structure={d.structure} odes={d.odes} name={d.network.name} /> : <OdesSection odes={d.odes} />}
          <VersionList
            base={base}
            versions={d.versions}
            current={d.version.number}
            latest={d.latestNumber}
            canEdit={d.canEdit}
            unknownAuthor={d.lab.isPublic ? "worked example" : "former member"}
          />
          {d.canEdit && <NetworkSettings network={d.network} canDelete={d.canDelete} result={actionData} />}
          {!d.canEdit && !d.guest && (
            <p className="text-sm text-muted">
              You can read and download this network; editors of <Link to={`/labs/${d.lab.slug}`}>{d.lab.name}</Link> can change it.
            </p>
          )}
        </div>
      </div>
    </div>
  );
}

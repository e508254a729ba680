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
import { StructureView } from "~/networks/ui/structure-view";
import { VersionList } from "~/networks/ui/version-list";
import { requireLabRole } from "~/permissions/permissions.server";

const SECTIONS = [
  ["reactions", "Reactions"],
  ["species", "Species"],
  ["stoichiometric-matrix", "Stoichiometric matrix"],
  ["complexes", "Complexes"],
  ["graph", "Complex graph"],
  ["rank", "Rank and deficiency"],
  ["deficiency-zero", "Deficiency zero theorem"],
  ["deficiency-one", "Deficiency one theorem"],
  ["conservation", "Conservation laws"],
  ["odes", "ODEs"],
] as const;

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
      <p className="flex flex-wrap gap-4 text-sm">
        {d.canEdit && (
          <Link to={newAnalysisPath(d.lab.slug, d.network.id, d.version.number)} className="rounded-md bg-accent px-3 py-1.5 font-medium text-accent-ink hover:bg-accent-strong" data-testid="start-analysis">
            Start analysis of version {d.version.number}
          </Link>
        )}
        <Link to={analysesPath(d.lab.slug)} className="self-center text-accent-strong hover:underline">
          Analyses of this lab
        </Link>
      </p>
      <VersionList base={base} versions={d.versions} current={d.version.number} latest={d.latestNumber} canEdit={d.canEdit} />
      <nav aria-label="On this page" className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
        {SECTIONS.map(([id, label]) => (
          <a key={id} href={`#${id}`} className="text-accent-strong hover:underline">
            {label}
          </a>
        ))}
      </nav>
      {d.structure ? (
        <StructureView structure={d.structure} name={d.network.name} />
      ) : (
        <StructurePending status={d.structureStatus === "failed" ? "failed" : "pending"} problem={d.structureProblem} />
      )}
      {d.canEdit && <NetworkSettings network={d.network} canDelete={d.canDelete} result={actionData} />}
      {!d.canEdit && (
        <p className="text-sm text-muted">
          You can read and download this network; editors of <Link to={`/labs/${d.lab.slug}`}>{d.lab.name}</Link> can change it.
        </p>
      )}
    </div>
  );
}

import { Link } from "react-router";
import type { Route } from "./+types/networks-show";
import { db } from "~/db.server";
import { runNetworkAction } from "~/networks/actions.server";
import { networkPageData, networkPath, requireNetwork } from "~/networks/pages.server";
import { NetworkHeader } from "~/networks/ui/network-header";
import { NetworkSettings } from "~/networks/ui/network-settings";
import { StructureView } from "~/networks/ui/structure-view";
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
      <div className="grid gap-8 xl:grid-cols-[minmax(0,1fr)_16rem]">
        <StructureView structure={d.structure} name={d.network.name} />
        <aside className="space-y-6 xl:sticky xl:top-4 xl:self-start">
          <VersionList base={base} versions={d.versions} current={d.version.number} latest={d.latestNumber} canEdit={d.canEdit} />
          <nav aria-label="On this page" className="hidden text-sm xl:block">
            <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-faint">On this page</p>
            {[
              ["reactions", "Reactions"],
              ["species", "Species"],
              ["stoichiometric-matrix", "Stoichiometric matrix"],
              ["complexes", "Complexes"],
              ["graph", "Complex graph"],
              ["rank", "Rank and deficiency"],
              ["deficiency-zero", "Deficiency zero theorem"],
              ["conservation", "Conservation laws"],
              ["odes", "ODEs"],
            ].map(([id, label]) => (
              <a key={id} href={`#${id}`} className="block py-0.5 text-muted hover:text-ink">
                {label}
              </a>
            ))}
          </nav>
        </aside>
      </div>
      {d.canEdit && <NetworkSettings network={d.network} canDelete={d.canDelete} result={actionData} />}
      {!d.canEdit && (
        <p className="text-sm text-muted">
          You can read and download this network; editors of <Link to={`/labs/${d.lab.slug}`}>{d.lab.name}</Link> can change it.
        </p>
      )}
    </div>
  );
}

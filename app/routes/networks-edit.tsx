import { data, Link, redirect } from "react-router";
import type { Route } from "./+types/networks-edit";
import { db } from "~/db.server";
import { csvToGrid } from "~/networks/grid";
import { requireNetwork, requireVersion } from "~/networks/pages.server";
import { networkPath } from "~/networks/paths";
import { saveVersion } from "~/networks/save.server";
import { NetworkEditor } from "~/networks/ui/network-editor";
import { apiStatus } from "~/permissions/api-errors";
import { requireLabRole } from "~/permissions/permissions.server";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Edit ${data?.network.name ?? "network"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  const network = await requireNetwork(db(), access, params.networkId);
  const version = await requireVersion(db(), network, null);
  return { lab: access.lab, network: { id: network.id, name: network.name }, version: { number: version.number, csv: version.csv } };
}

export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  const network = await requireNetwork(db(), access, params.networkId);
  const form = await request.formData();
  const result = await saveVersion(db(), network, { authorId: access.user.id, csv: form.get("csv"), changeNote: form.get("changeNote") });
  if (!result.ok) return data({ error: { code: result.code, message: result.message, details: result.details } }, { status: apiStatus(result.code) });
  throw redirect(`${networkPath(access.lab.slug, network.id)}/versions?from=${result.version.number - 1}&to=${result.version.number}`);
}

export default function EditNetworkPage({ loaderData, actionData }: Route.ComponentProps) {
  const { lab, network, version } = loaderData;
  const loaded = csvToGrid(version.csv);
  const rows = loaded.rows.map((r) => ({ ...r, sourceLine: undefined }));
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-muted">
          <Link to={networkPath(lab.slug, network.id)} className="hover:underline">
            {network.name}
          </Link>
        </p>
        <h1 className="text-2xl font-semibold tracking-tight">New version</h1>
        <p className="mt-1 text-sm text-muted">Starting from version {version.number}. Saving adds version {version.number + 1}; earlier versions never change.</p>
      </header>
      <NetworkEditor mode="version" initialRows={rows} initialConstants={loaded.constants} initialValues={loaded.initial} failure={actionData} />
    </div>
  );
}

import { data, Link, redirect } from "react-router";
import type { Route } from "./+types/networks-new";
import { db } from "~/db.server";
import { DEMO_NETWORKS } from "~/networks/demos";
import { emptyRow } from "~/networks/grid";
import { networkPath } from "~/networks/paths";
import { createNetwork } from "~/networks/save.server";
import { NetworkEditor } from "~/networks/ui/network-editor";
import { apiStatus } from "~/permissions/api-errors";
import { requireLabRole } from "~/permissions/permissions.server";

export const meta: Route.MetaFunction = () => [{ title: "New network · Stillpoint" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  return { lab: access.lab };
}

export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "editor");
  const form = await request.formData();
  const result = await createNetwork(db(), {
    labId: access.lab.id,
    authorId: access.user.id,
    name: form.get("name"),
    description: form.get("description"),
    tags: form.get("tags"),
    csv: form.get("csv"),
    changeNote: form.get("changeNote"),
  });
  if (!result.ok) return data({ error: { code: result.code, message: result.message, details: result.details } }, { status: apiStatus(result.code) });
  throw redirect(networkPath(access.lab.slug, result.network.id));
}

export default function NewNetworkPage({ loaderData, actionData }: Route.ComponentProps) {
  const { lab } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-muted">
          <Link to={`/labs/${lab.slug}/networks`} className="hover:underline">
            {lab.name} · Networks
          </Link>
        </p>
        <h1 className="text-2xl font-semibold tracking-tight">New network</h1>
      </header>
      <NetworkEditor mode="create" initialRows={[emptyRow()]} details={{ name: "", description: "", tags: "" }} demos={DEMO_NETWORKS} failure={actionData} />
    </div>
  );
}

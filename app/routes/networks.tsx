import { Link } from "react-router";
import type { Route } from "./+types/networks";
import { db } from "~/db.server";
import { networkTableRows } from "~/networks/pages.server";
import { NetworkTable } from "~/networks/ui/network-table";
import { requireLabRole } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { GuestNotice } from "~/labs/guest-notice";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Networks · ${data?.lab.name ?? "Lab"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  const rows = await networkTableRows(db(), access, includeArchived);
  return { lab: access.lab, guest: access.guest, canEdit: hasRole(access.role, "editor"), includeArchived, rows };
}

export default function NetworksPage({ loaderData }: Route.ComponentProps) {
  const { lab, guest, canEdit, includeArchived, rows } = loaderData;
  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm text-muted">
            <Link to={`/labs/${lab.slug}`} className="hover:underline">
              {lab.name}
            </Link>
          </p>
          <h1 className="text-2xl font-semibold tracking-tight">Networks</h1>
          <p className="mt-1 max-w-prose text-sm text-muted">
            Every reaction network of the lab, with its structure at a glance. Click a column title to sort; filter by name or by a species it contains.
          </p>
        </div>
        <div className="flex gap-2 text-sm">
          <Link to={includeArchived ? "?" : "?archived=1"} className="btn-quiet">
            {includeArchived ? "Hide archived" : "Show archived"}
          </Link>
          {canEdit && (
            <Link to={`/labs/${lab.slug}/networks/new`} className="btn-primary">
              New network
            </Link>
          )}
        </div>
      </header>
      {guest && <GuestNotice slug={lab.slug} />}
      {rows.length === 0 ? (
        <p className="card text-sm text-muted">
          No networks yet.{canEdit ? " Start one with “New network”: upload a CSV file or type the reactions." : " Editors of the lab can add them."}
        </p>
      ) : (
        <NetworkTable rows={rows} />
      )}
    </div>
  );
}

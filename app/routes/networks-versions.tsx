import { Form, Link } from "react-router";
import type { Route } from "./+types/networks-versions";
import { db } from "~/db.server";
import { listVersions } from "~/networks/networks.server";
import { requireNetwork, requireVersion, versionDiff, versionJson } from "~/networks/pages.server";
import { networkPath } from "~/networks/paths";
import { DiffView } from "~/networks/ui/diff-view";
import { StructurePending } from "~/networks/ui/structure-pending";
import { requireLabRole } from "~/permissions/permissions.server";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Versions of ${data?.network.name ?? "network"} · Stillpoint` }];

/** ?from=N&to=M compares two versions (default: the two newest). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId);
  const versions = await listVersions(db(), network.id);
  const url = new URL(request.url);
  const to = await requireVersion(db(), network, url.searchParams.get("to") ?? String(versions[0]!.number));
  const from = await requireVersion(db(), network, url.searchParams.get("from") ?? String(versions[1]?.number ?? to.number));
  return {
    base: networkPath(access.lab.slug, network.id),
    network: { name: network.name },
    versions: versions.map((v) => versionJson(v)),
    comparison: await versionDiff(db(), from, to),
  };
}

export default function VersionsPage({ loaderData }: Route.ComponentProps) {
  const { base, network, versions, comparison } = loaderData;
  const select = (name: string, value: number) => (
    <select name={name} defaultValue={value} className="rounded-md border border-line bg-surface px-2 py-1.5">
      {versions.map((v) => (
        <option key={v.number} value={v.number}>
          version {v.number}
        </option>
      ))}
    </select>
  );
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-muted">
          <Link to={base} className="hover:underline">
            {network.name}
          </Link>
        </p>
        <h1 className="text-2xl font-semibold tracking-tight">Versions and changes</h1>
      </header>
      <Form method="get" className="flex flex-wrap items-center gap-2 text-sm">
        Compare {select("from", comparison.from.number)} with {select("to", comparison.to.number)}
        <button type="submit" className="btn-quiet py-1.5">
          Compare
        </button>
      </Form>
      <p className="text-sm text-muted" data-testid="diff-title">
        What changed from version {comparison.from.number} ({comparison.from.author ?? "former member"}) to version {comparison.to.number} ({comparison.to.author ?? "former member"}
        {comparison.to.changeNote ? `: “${comparison.to.changeNote}”` : ""}).
      </p>
      {comparison.diff ? <DiffView diff={comparison.diff} /> : <StructurePending status="pending" what="The comparison" />}
      <section className="space-y-2">
        <h2 className="text-lg font-semibold">All versions</h2>
        <div className="relative overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="border-b border-line text-left text-xs uppercase tracking-wide text-muted">
              <tr>
                <th className="py-1.5 pr-4">Version</th>
                <th className="py-1.5 pr-4">Saved</th>
                <th className="py-1.5 pr-4">Author</th>
                <th className="py-1.5 pr-4">Change note</th>
                <th className="py-1.5 pr-4">Content hash (SHA-256)</th>
              </tr>
            </thead>
            <tbody>
              {versions.map((v) => (
                <tr key={v.number} className="border-b border-line">
                  <td className="py-1.5 pr-4">
                    <Link to={`${base}?v=${v.number}`} className="text-accent-strong hover:underline">
                      v{v.number}
                    </Link>
                  </td>
                  <td className="py-1.5 pr-4 whitespace-nowrap">{formatDateTime(v.createdAt)}</td>
                  <td className="py-1.5 pr-4">{v.author ?? "former member"}</td>
                  <td className="py-1.5 pr-4">{v.changeNote}</td>
                  <td className="py-1.5 pr-4 font-mono text-xs text-muted">{v.contentHash.slice(0, 16)}…</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}

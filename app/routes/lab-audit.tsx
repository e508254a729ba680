import { Link } from "react-router";
import type { Route } from "./+types/lab-audit";
import { db } from "~/db.server";
import { listLabAudit } from "~/shared/audit.server";
import { auditSentence } from "~/labs/audit-text";
import { requireLabRole } from "~/permissions/permissions.server";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Audit log · Stillpoint" }];

/** Owners read what happened in their lab (memberships, invitations, uploads, versions, runs), one sentence per event. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "owner");
  const events = await listLabAudit(db(), access.lab.id);
  return { lab: access.lab, events: events.map((e) => ({ id: e.id, createdAt: e.createdAt, kind: e.kind, sentence: auditSentence(e) })) };
}

export default function Audit({ loaderData }: Route.ComponentProps) {
  const { lab, events } = loaderData;
  return (
    <div className="space-y-6">
      <header>
        <Link to={`/labs/${lab.slug}`} className="text-sm text-muted hover:text-ink">← {lab.name}</Link>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">Audit log</h1>
      </header>
      <div className="relative overflow-x-auto">
        <table className="w-full text-left text-sm" data-testid="audit">
          <thead className="border-b border-line text-xs uppercase tracking-wide text-faint">
            <tr><th className="py-2">When</th><th>What happened</th></tr>
          </thead>
          <tbody>
            {events.map((e) => (
              <tr key={e.id} className="border-b border-line align-top">
                <td className="py-2 whitespace-nowrap text-muted">{formatDateTime(e.createdAt)}</td>
                <td className="py-2 pl-4" data-testid="audit-sentence" title={e.kind}>{e.sentence}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

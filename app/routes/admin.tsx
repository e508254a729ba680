import type { Route } from "./+types/admin";
import { db } from "~/db.server";
import { listAllLabs, listAllUsers } from "~/admin/admin.server";
import { requireSiteAdmin } from "~/permissions/permissions.server";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Site administration · Stillpoint" }];

/** Site administrators see who has an account and which labs exist (not the labs' contents). */
export async function loader({ request }: Route.LoaderArgs) {
  await requireSiteAdmin(request);
  const [users, labs] = await Promise.all([listAllUsers(db()), listAllLabs(db())]);
  return { users, labs };
}

export default function Admin({ loaderData }: Route.ComponentProps) {
  const { users, labs } = loaderData;
  const th = "py-2";
  return (
    <div className="space-y-10">
      <h1 className="text-2xl font-semibold tracking-tight">Site administration</h1>
      <section>
        <h2 className="font-semibold">Users ({users.length})</h2>
        <div className="relative mt-2 overflow-x-auto">
          <table className="w-full text-left text-sm" data-testid="admin-users">
            <thead className="border-b border-line text-xs uppercase tracking-wide text-faint">
              <tr><th className={th}>Name</th><th>E-mail</th><th>Labs</th><th>Joined</th></tr>
            </thead>
            <tbody>
              {users.map((u) => (
                <tr key={u.id} className="border-b border-line">
                  <td className="py-2">{u.displayName}{u.isSiteAdmin && <span className="text-xs text-accent"> admin</span>}</td>
                  <td className="text-muted">{u.email}</td>
                  <td>{u.labCount}</td>
                  <td className="text-muted">{formatDateTime(u.createdAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
      <section>
        <h2 className="font-semibold">Labs ({labs.length})</h2>
        <div className="relative mt-2 overflow-x-auto">
          <table className="w-full text-left text-sm" data-testid="admin-labs">
            <thead className="border-b border-line text-xs uppercase tracking-wide text-faint">
              <tr><th className={th}>Name</th><th>Slug</th><th>Members</th><th>Networks</th><th>Created</th></tr>
            </thead>
            <tbody>
              {labs.map((l) => (
                <tr key={l.id} className="border-b border-line">
                  <td className="py-2">{l.name}</td>
                  <td className="font-mono text-xs text-muted">{l.slug}</td>
                  <td>{l.memberCount}</td>
                  <td>{l.networkCount}</td>
                  <td className="text-muted">{formatDateTime(l.createdAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}

import { data, Form, Link } from "react-router";
import type { Route } from "./+types/lab-members";
import { db } from "~/db.server";
import { listOpenInvitations } from "~/labs/invitations.server";
import { listMembers } from "~/labs/memberships.server";
import { parseMemberIntent, runMemberIntent } from "~/labs/lab-actions.server";
import { FormMessage, inputClass, IntentButton, RoleBadge } from "~/labs/ui";
import { requireLabMember, requireLabRole } from "~/permissions/permissions.server";
import { hasRole } from "~/permissions/roles";
import { LAB_ROLES } from "~/db/schema";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `Members of ${data?.lab.name ?? "lab"} · Stillpoint` }];

/** Every member sees who is in the lab (guests of a public lab do not); only owners see pending invitations. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = requireLabMember(await requireLabRole(request, params.labSlug, "viewer"));
  const isOwner = hasRole(access.role, "owner");
  const [members, invitations] = await Promise.all([
    listMembers(db(), access.lab.id),
    isOwner ? listOpenInvitations(db(), access.lab.id) : Promise.resolve([]),
  ]);
  return { lab: access.lab, role: access.role, me: access.user.id, members, invitations };
}

/** Invite, resend, revoke, change role, remove: owners only. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireLabRole(request, params.labSlug, "owner");
  const form = await request.formData();
  const intent = parseMemberIntent(form);
  if (!intent) return data({ status: 400, error: "Unknown action." }, { status: 400 });
  const result = await runMemberIntent(access, intent, form);
  return data(result, { status: result.status });
}

export default function Members({ loaderData, actionData }: Route.ComponentProps) {
  const { lab, role, me, members, invitations } = loaderData;
  const isOwner = hasRole(role, "owner");
  return (
    <div className="space-y-8">
      <header>
        <Link to={`/labs/${lab.slug}`} className="text-sm text-muted hover:text-ink">
          ← {lab.name}
        </Link>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight">Members</h1>
      </header>
      <FormMessage result={actionData} />
      <div className="relative overflow-x-auto">
        <table className="w-full text-left text-sm" data-testid="members">
          <thead className="border-b border-line text-xs uppercase tracking-wide text-faint">
            <tr>
              <th className="py-2">Name</th>
              <th>E-mail</th>
              <th>Role</th>
              <th>Member since</th>
              {isOwner && <th className="sr-only">Actions</th>}
            </tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.userId} className="border-b border-line">
                <td className="py-2">{m.displayName}{m.userId === me && <span className="text-faint"> (you)</span>}</td>
                <td className="text-muted">{m.email}</td>
                <td>
                  {isOwner ? (
                    <Form method="post" className="flex items-center gap-2">
                      <input type="hidden" name="intent" value="change-role" />
                      <input type="hidden" name="userId" value={m.userId} />
                      <select name="role" defaultValue={m.role} aria-label={`Role of ${m.displayName}`} className="rounded-md border border-line bg-surface px-2 py-1">
                        {LAB_ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
                      </select>
                      <button type="submit" className="text-xs text-accent hover:underline">Save</button>
                    </Form>
                  ) : (
                    <RoleBadge role={m.role} />
                  )}
                </td>
                <td className="text-muted">{formatDateTime(m.since).slice(0, 10)}</td>
                {isOwner && (
                  <td className="text-right">
                    <IntentButton intent="remove" fields={{ userId: m.userId }} tone="danger">Remove</IntentButton>
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {isOwner && (
        <>
          <Form method="post" className="card flex max-w-2xl flex-wrap items-end gap-3">
            <input type="hidden" name="intent" value="invite" />
            <div className="min-w-64 flex-1 space-y-1">
              <label htmlFor="invite-email" className="block text-sm font-medium">Invite by e-mail</label>
              <input id="invite-email" name="email" type="email" required placeholder="colleague@example.org" className={inputClass} />
            </div>
            <div className="space-y-1">
              <label htmlFor="invite-role" className="block text-sm font-medium">Role</label>
              <select id="invite-role" name="role" defaultValue="viewer" className={inputClass}>
                {LAB_ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
              </select>
            </div>
            <button type="submit" className="btn-primary">Send invitation</button>
          </Form>
          <section>
            <h2 className="font-semibold">Pending invitations</h2>
            {invitations.length === 0 ? (
              <p className="mt-2 text-sm text-muted">None.</p>
            ) : (
              <ul className="mt-2 divide-y divide-line text-sm" data-testid="invitations">
                {invitations.map((inv) => (
                  <li key={inv.id} className="flex flex-wrap items-center gap-3 py-2">
                    <span className="flex-1">
                      {inv.email} <RoleBadge role={inv.role} />{" "}
                      <span className={inv.status === "expired" ? "text-danger" : "text-faint"}>
                        {inv.status === "expired" ? "expired" : `expires ${formatDateTime(inv.expiresAt)}`}
                      </span>
                    </span>
                    <IntentButton intent="resend" fields={{ invitationId: inv.id }}>Resend</IntentButton>
                    <IntentButton intent="revoke" fields={{ invitationId: inv.id }} tone="danger">Revoke</IntentButton>
                  </li>
                ))}
              </ul>
            )}
          </section>
        </>
      )}
    </div>
  );
}

import { data, Form, Link } from "react-router";
import type { Route } from "./+types/account";
import { db } from "~/db.server";
import { listApiTokens } from "~/account/api-tokens.server";
import { parseAccountIntent, runAccountIntent } from "~/account/account-actions.server";
import { listAccountEvents } from "~/shared/audit.server";
import { listLabsOf } from "~/labs/labs.server";
import type { ActionResult } from "~/shared/form";
import { FormMessage, inputClass, IntentButton, RoleBadge } from "~/labs/ui";
import { requireUser } from "~/permissions/permissions.server";
import { formatDateTime } from "~/shared/dates";

export const meta: Route.MetaFunction = () => [{ title: "Your account · Stillpoint" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const [labs, tokens, events] = await Promise.all([
    listLabsOf(db(), user.id),
    listApiTokens(db(), user.id),
    listAccountEvents(db(), user.id),
  ]);
  return { user, labs, tokens, events };
}

export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = await request.formData();
  const intent = parseAccountIntent(form);
  const result: ActionResult = intent ? await runAccountIntent(user, intent, form) : { status: 400, error: "Unknown action." };
  return data(result, { status: result.status });
}

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  const { user, labs, tokens, events } = loaderData;
  return (
    <div className="space-y-10">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Your account</h1>
        <p className="mt-1 text-muted">{user.email}{user.isSiteAdmin && <> · <Link to="/admin" className="text-accent hover:underline">site administration</Link></>}</p>
      </header>
      <FormMessage result={actionData} />
      {actionData?.secret && (
        <div className="card space-y-2 border-signal" data-testid="new-token">
          <p className="text-sm font-medium">Your new token (shown once):</p>
          <code className="block break-all rounded-md bg-sunken p-3 text-sm">{actionData.secret}</code>
          <p className="text-xs text-muted">Send it as <code>Authorization: Bearer …</code> to the /api routes. It acts with your roles.</p>
        </div>
      )}
      <Form method="post" className="flex max-w-lg items-end gap-3">
        <input type="hidden" name="intent" value="rename" />
        <label className="flex-1 space-y-1 text-sm font-medium">
          Display name
          <input name="displayName" defaultValue={user.displayName} required maxLength={100} className={inputClass} />
        </label>
        <button type="submit" className="btn-quiet">Save</button>
      </Form>
      <section>
        <h2 className="font-semibold">Labs</h2>
        <ul className="mt-2 space-y-1 text-sm">
          {labs.map((l) => (
            <li key={l.id}><Link to={`/labs/${l.slug}`} className="text-accent hover:underline">{l.name}</Link> <RoleBadge role={l.role} /></li>
          ))}
          {labs.length === 0 && <li className="text-muted">None yet — <Link to="/labs" className="text-accent">create a lab</Link>.</li>}
        </ul>
      </section>
      <section className="space-y-3">
        <h2 className="font-semibold">Personal API tokens</h2>
        <div className="relative overflow-x-auto">
          <table className="w-full text-left text-sm" data-testid="tokens">
            <thead className="border-b border-line text-xs uppercase tracking-wide text-faint">
              <tr><th className="py-2">Name</th><th>Created</th><th>Expires</th><th>Last used</th><th /></tr>
            </thead>
            <tbody>
              {tokens.length === 0 && (
                <tr><td colSpan={5} className="py-2 text-muted">No tokens yet. Scripts use one to call the JSON API as you.</td></tr>
              )}
              {tokens.map((t) => (
                <tr key={t.id} className="border-b border-line">
                  <td className="py-2">{t.name}</td>
                  <td className="text-muted">{formatDateTime(t.createdAt)}</td>
                  <td className="text-muted">{t.expiresAt ? formatDateTime(t.expiresAt) : "never"}</td>
                  <td className="text-muted">{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : "never"}</td>
                  <td className="text-right">
                    {t.revokedAt ? <span className="text-xs text-faint">revoked</span> : (
                      <IntentButton intent="revoke-token" fields={{ tokenId: t.id }} tone="danger">Revoke</IntentButton>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <Form method="post" className="flex flex-wrap items-end gap-3">
          <input type="hidden" name="intent" value="create-token" />
          <label className="space-y-1 text-sm font-medium">Name<input name="name" required maxLength={100} placeholder="e.g. batch upload script" className={inputClass} /></label>
          <label className="w-56 space-y-1 text-sm font-medium">Expires in days (empty: never)<input name="expiresInDays" inputMode="numeric" placeholder="90" className={inputClass} /></label>
          <button type="submit" className="btn-quiet">Create token</button>
        </Form>
        <p className="text-sm text-muted">
          What the API offers: <a href="/api/openapi.json" className="text-accent hover:underline" data-testid="openapi-link">the API description (OpenAPI 3.1, JSON)</a>.
        </p>
      </section>
      <section>
        <h2 className="font-semibold">Recent account activity</h2>
        <ul className="mt-2 space-y-1 text-sm text-muted">
          {events.map((e) => <li key={e.id}><span className="font-mono text-xs">{e.kind}</span> · {formatDateTime(e.created_at)}</li>)}
        </ul>
      </section>
      <section className="flex flex-wrap gap-3">
        <Form method="post" action="/sign-out"><button type="submit" className="btn-quiet">Sign out</button></Form>
        <Form method="post">
          <input type="hidden" name="intent" value="sign-out-everywhere" />
          <button type="submit" className="btn-quiet text-danger">Sign out everywhere</button>
        </Form>
      </section>
    </div>
  );
}

import { data, Form, Link, redirect } from "react-router";
import type { Route } from "./+types/invitation";
import { db } from "~/db.server";
import { commitSession, getSession } from "~/auth/session.server";
import { acceptInvitation, findInvitationByToken, InvitationError } from "~/labs/invitations.server";
import { FormMessage, RoleBadge } from "~/labs/ui";
import { getOptionalUser, requireUser } from "~/permissions/permissions.server";
import { notFound } from "~/shared/responses";

export const meta: Route.MetaFunction = () => [{ title: "Invitation · Stillpoint" }];

/**
 * GET /invitations/:token — the secret link from the e-mail. Anyone holding it may see which lab
 * it is for; accepting needs the invited address signed in. Unknown tokens are a plain 404.
 */
export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await getOptionalUser(request);
  const invitation = await findInvitationByToken(db(), params.token);
  if (!invitation) throw notFound("This invitation link is not valid.");
  const path = new URL(request.url).pathname;
  return {
    invitation: { labName: invitation.labName, role: invitation.role, email: invitation.email, status: invitation.status },
    signedInAs: user?.email ?? null,
    signInUrl: `/sign-in?returnTo=${encodeURIComponent(path)}&email=${encodeURIComponent(invitation.email)}`,
  };
}

export async function action({ request, params }: Route.ActionArgs) {
  const user = await requireUser(request);
  try {
    const accepted = await acceptInvitation(db(), { token: params.token, userId: user.id, email: user.email });
    const session = await getSession(request);
    session.set("labSlug", accepted.labSlug);
    throw redirect(`/labs/${accepted.labSlug}`, { headers: { "Set-Cookie": await commitSession(session) } });
  } catch (err) {
    if (!(err instanceof InvitationError)) throw err;
    const status = err.code === "wrong_address" ? 403 : err.code === "not_found" ? 404 : 410;
    return data({ error: err.message }, { status });
  }
}

export default function Invitation({ loaderData, actionData }: Route.ComponentProps) {
  const { invitation, signedInAs, signInUrl } = loaderData;
  const matches = signedInAs === invitation.email;
  return (
    <section className="mx-auto max-w-md space-y-4">
      <h1 className="text-2xl font-semibold tracking-tight">Join {invitation.labName}</h1>
      <p className="text-muted">
        This invitation is for <strong className="text-ink">{invitation.email}</strong>, as <RoleBadge role={invitation.role} />.
      </p>
      {invitation.status !== "pending" ? (
        <FormMessage result={{ error: invitation.status === "expired" ? "This invitation has expired. Ask the lab owner to send a new one." : invitation.status === "accepted" ? "This invitation has already been used." : "This invitation was withdrawn." }} />
      ) : !signedInAs ? (
        <Link to={signInUrl} className="btn-primary">Sign in as {invitation.email} to accept</Link>
      ) : !matches ? (
        <div className="space-y-3">
          <FormMessage result={{ error: `You are signed in as ${signedInAs}. Sign out, then sign in as ${invitation.email} to accept.` }} />
          <Form method="post" action="/sign-out"><button type="submit" className="btn-quiet">Sign out</button></Form>
        </div>
      ) : (
        <Form method="post" className="space-y-3">
          <FormMessage result={actionData} />
          <button type="submit" className="btn-primary">Accept invitation</button>
        </Form>
      )}
    </section>
  );
}

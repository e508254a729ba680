import { data, Form, redirect, useNavigation } from "react-router";
import type { Route } from "./+types/sign-in";
import { clientKey } from "~/auth/client-key.server";
import { requestSignInCode } from "~/auth/sign-in.server";
import { safeReturnTo } from "~/auth/session.server";
import { getOptionalUser } from "~/permissions/permissions.server";
import { FormMessage, inputClass, labelClass } from "~/labs/ui";

export const meta: Route.MetaFunction = () => [{ title: "Sign in · Stillpoint" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await getOptionalUser(request);
  const url = new URL(request.url);
  const returnTo = safeReturnTo(url.searchParams.get("returnTo"));
  if (user) throw redirect(returnTo);
  return {
    returnTo,
    email: url.searchParams.get("email") ?? "",
    linkExpired: url.searchParams.get("link") === "expired",
  };
}

export async function action({ request, context }: Route.ActionArgs) {
  const refusal = await requestSignInCode(request, clientKey(context));
  return data(refusal, { status: refusal.status });
}

export default function SignIn({ loaderData, actionData }: Route.ComponentProps) {
  const busy = useNavigation().state !== "idle";
  return (
    <section className="mx-auto max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Sign in</h1>
      <p className="mt-2 text-muted">
        Enter your e-mail address. We send you a six-character code and a sign-in link; no password needed. New here?
        The same step creates your account.
      </p>
      {loaderData.linkExpired && (
        <div className="mt-4">
          <FormMessage result={{ error: "That sign-in link has expired or was already used. Please request a new code." }} />
        </div>
      )}
      <Form method="post" className="card mt-6 space-y-4">
        <input type="hidden" name="returnTo" value={loaderData.returnTo} />
        <div className="space-y-1">
          <label htmlFor="email" className={labelClass}>
            E-mail address
          </label>
          <input id="email" name="email" type="email" autoComplete="email" required defaultValue={loaderData.email} className={inputClass} />
        </div>
        <FormMessage result={actionData} />
        <button type="submit" className="btn-primary" disabled={busy}>
          {busy ? "Sending…" : "Send me a code"}
        </button>
      </Form>
    </section>
  );
}

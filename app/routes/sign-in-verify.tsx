import { data, Form, Link, redirect } from "react-router";
import type { Route } from "./+types/sign-in-verify";
import { verifySignInCode } from "~/auth/sign-in.server";
import { readTotpCookie } from "~/auth/totp-cookie.server";
import { SIGN_IN_POLICY } from "~/auth/login-codes.server";
import { getOptionalUser } from "~/permissions/permissions.server";
import { FormMessage, inputClass, labelClass } from "~/labs/ui";

export const meta: Route.MetaFunction = () => [{ title: "Enter your code · Stillpoint" }];

export async function loader({ request }: Route.LoaderArgs) {
  if (await getOptionalUser(request)) throw redirect("/labs");
  const { email, error } = readTotpCookie(request);
  if (!email && !error) throw redirect("/sign-in");
  return { email: email ?? null, error: error ?? null, minutes: SIGN_IN_POLICY.codeMinutes };
}

export async function action({ request }: Route.ActionArgs) {
  const refusal = await verifySignInCode(request);
  return data(refusal, { status: refusal.status });
}

export default function VerifyCode({ loaderData, actionData }: Route.ComponentProps) {
  const { email, error, minutes } = loaderData;
  const message = actionData ?? (error ? { error } : undefined);
  return (
    <section className="mx-auto max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Check your e-mail</h1>
      {email ? (
        <p className="mt-2 text-muted">
          If <strong className="text-ink">{email}</strong> can receive mail, a code is on its way. It works once and
          expires in {minutes} minutes. You can also follow the link in the message, in this browser.
        </p>
      ) : (
        <p className="mt-2 text-muted">This sign-in can no longer continue here.</p>
      )}
      {email && (
        <Form method="post" className="card mt-6 space-y-4">
          <div className="space-y-1">
            <label htmlFor="code" className={labelClass}>
              Code
            </label>
            <input
              id="code"
              name="code"
              required
              autoComplete="one-time-code"
              autoCapitalize="characters"
              spellCheck={false}
              maxLength={12}
              className={`${inputClass} font-mono text-lg tracking-widest uppercase`}
            />
          </div>
          <FormMessage result={message} />
          <button type="submit" className="btn-primary">
            Sign in
          </button>
        </Form>
      )}
      {!email && <div className="mt-4"><FormMessage result={message} /></div>}
      <div className="mt-6 flex flex-wrap items-center gap-4 text-sm">
        {email && (
          <Form method="post" action="/sign-in">
            <input type="hidden" name="email" value={email} />
            <button type="submit" className="text-accent hover:underline">
              Send a new code
            </button>
          </Form>
        )}
        <Link to="/sign-in" className="text-muted hover:text-ink">
          Use another address
        </Link>
      </div>
    </section>
  );
}

import { data, Form, redirect } from "react-router";
import type { Route } from "./+types/welcome";
import { completeAccount } from "~/auth/sign-in.server";
import { getSession } from "~/auth/session.server";
import { getOptionalUser } from "~/permissions/permissions.server";
import { FormMessage, inputClass, labelClass } from "~/labs/ui";

export const meta: Route.MetaFunction = () => [{ title: "Welcome · Stillpoint" }];

/** First sign-in: the address is verified (pendingEmail in the session); ask for a name. */
export async function loader({ request }: Route.LoaderArgs) {
  if (await getOptionalUser(request)) throw redirect("/labs");
  const email = (await getSession(request)).get("pendingEmail");
  if (!email) throw redirect("/sign-in");
  return { email };
}

export async function action({ request }: Route.ActionArgs) {
  const refusal = await completeAccount(request);
  return data(refusal, { status: refusal.status });
}

export default function Welcome({ loaderData, actionData }: Route.ComponentProps) {
  return (
    <section className="mx-auto max-w-md">
      <h1 className="text-2xl font-semibold tracking-tight">Welcome to Stillpoint</h1>
      <p className="mt-2 text-muted">
        You signed in as <strong className="text-ink">{loaderData.email}</strong>. How should your colleagues see you?
      </p>
      <Form method="post" className="card mt-6 space-y-4">
        <div className="space-y-1">
          <label htmlFor="displayName" className={labelClass}>
            Display name
          </label>
          <input id="displayName" name="displayName" required maxLength={100} autoComplete="name" className={inputClass} />
        </div>
        <FormMessage result={actionData} />
        <button type="submit" className="btn-primary">
          Create my account
        </button>
      </Form>
    </section>
  );
}

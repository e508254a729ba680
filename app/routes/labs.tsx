import { data, Form, Link, redirect } from "react-router";
import type { Route } from "./+types/labs";
import { db } from "~/db.server";
import { commitSession, getSession } from "~/auth/session.server";
import { createLab, listLabsOf, parseLabName } from "~/labs/labs.server";
import { field } from "~/shared/form";
import { FormMessage, inputClass, labelClass, RoleBadge } from "~/labs/ui";
import { requireLabRole, requireUser } from "~/permissions/permissions.server";

export const meta: Route.MetaFunction = () => [{ title: "Labs · Stillpoint" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const session = await getSession(request);
  const labs = await listLabsOf(db(), user.id);
  return { labs, activeSlug: session.get("labSlug") ?? labs[0]?.slug ?? null };
}

/** intent=create makes a lab (you become its owner); intent=switch makes a lab your working lab. */
export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = await request.formData();
  const intent = field(form, "intent");
  const session = await getSession(request);
  if (intent === "switch") {
    const access = await requireLabRole(request, field(form, "slug"), "viewer");
    session.set("labSlug", access.lab.slug);
    throw redirect(`/labs/${access.lab.slug}`, { headers: { "Set-Cookie": await commitSession(session) } });
  }
  if (intent !== "create") return data({ error: "Unknown action." }, { status: 400 });
  const name = parseLabName(field(form, "name"));
  if (!name.ok) return data({ error: name.message }, { status: 400 });
  const lab = await createLab(db(), { userId: user.id, name: name.value });
  session.set("labSlug", lab.slug);
  throw redirect(`/labs/${lab.slug}`, { headers: { "Set-Cookie": await commitSession(session) } });
}

export default function Labs({ loaderData, actionData }: Route.ComponentProps) {
  const { labs, activeSlug } = loaderData;
  return (
    <div className="space-y-8">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Your labs</h1>
        <p className="mt-1 text-muted">A lab is a shared workspace: its members see its networks and analyses according to their role.</p>
      </header>
      {labs.length === 0 ? (
        <p className="card text-muted">You are not in any lab yet. Create one below, or accept an invitation from a colleague.</p>
      ) : (
        <ul className="grid grid-cols-1 gap-3 md:grid-cols-2" data-testid="lab-list">
          {labs.map((lab) => (
            <li key={lab.id} className="card flex items-center justify-between gap-4 p-4">
              <div>
                <Link to={`/labs/${lab.slug}`} className="font-medium text-ink hover:text-accent">
                  {lab.name}
                </Link>
                <p className="mt-1 flex items-center gap-2 text-xs text-muted">
                  <RoleBadge role={lab.role} /> {lab.memberCount} member{lab.memberCount === 1 ? "" : "s"}
                </p>
              </div>
              {lab.slug === activeSlug ? (
                <span className="text-xs font-medium text-accent">Working lab</span>
              ) : (
                <Form method="post">
                  <input type="hidden" name="intent" value="switch" />
                  <input type="hidden" name="slug" value={lab.slug} />
                  <button type="submit" className="btn-quiet py-1 text-xs">
                    Switch to this lab
                  </button>
                </Form>
              )}
            </li>
          ))}
        </ul>
      )}
      <Form method="post" className="card max-w-md space-y-3">
        <h2 className="font-semibold">Create a lab</h2>
        <input type="hidden" name="intent" value="create" />
        <div className="space-y-1">
          <label htmlFor="lab-name" className={labelClass}>
            Name
          </label>
          <input id="lab-name" name="name" required maxLength={120} placeholder="e.g. Enzyme Kinetics Group" className={inputClass} />
        </div>
        <FormMessage result={actionData} />
        <button type="submit" className="btn-primary">
          Create lab
        </button>
      </Form>
    </div>
  );
}

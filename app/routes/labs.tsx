import { data, Form, Link, redirect } from "react-router";
import type { Route } from "./+types/labs";
import { db } from "~/db.server";
import { commitSession, getSession } from "~/auth/session.server";
import { countNetworksOf, createLab, listLabsOf, listPublicLabs, parseLabName } from "~/labs/labs.server";
import { copyExamples, labForCopy } from "~/labs/examples.server";
import { CopyExamplesButton, FirstSteps } from "~/labs/first-steps";
import { field } from "~/shared/form";
import { FormMessage, inputClass, labelClass, RoleBadge } from "~/labs/ui";
import { requireLabMember, requireLabRole, requireUser } from "~/permissions/permissions.server";

export const meta: Route.MetaFunction = () => [{ title: "Labs · Stillpoint" }];

export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireUser(request);
  const session = await getSession(request);
  const [labs, publicLabs, networkCount] = await Promise.all([listLabsOf(db(), user.id), listPublicLabs(db()), countNetworksOf(db(), user.id)]);
  const activeSlug = session.get("labSlug") ?? labs[0]?.slug ?? null;
  return { labs, publicLabs, networkCount, activeSlug };
}

/**
 * intent=create makes a lab (you become its owner); intent=switch makes a lab your working lab;
 * intent=copy-examples copies a public lab's networks into a lab you edit (a new one of your own
 * when you have none) and opens its network list.
 */
export async function action({ request }: Route.ActionArgs) {
  const user = await requireUser(request);
  const form = await request.formData();
  const intent = field(form, "intent");
  const session = await getSession(request);
  if (intent === "switch") {
    // A guest reads a public lab but does not work in it: switching there is for members.
    const access = requireLabMember(await requireLabRole(request, field(form, "slug"), "viewer"));
    session.set("labSlug", access.lab.slug);
    throw redirect(`/labs/${access.lab.slug}`, { headers: { "Set-Cookie": await commitSession(session) } });
  }
  if (intent === "copy-examples") {
    const from = await requireLabRole(request, field(form, "from"), "viewer");
    if (!from.lab.isPublic) return data({ error: "Only the public worked examples can be copied this way.", about: "copy" }, { status: 400 });
    const to = field(form, "to") ? (await requireLabRole(request, field(form, "to"), "editor")).lab : await labForCopy(db(), user, session.get("labSlug"));
    if (!to) return data({ error: "You are a viewer in every lab you belong to: create a lab of your own to copy the examples into.", about: "copy" }, { status: 403 });
    if (to.id === from.lab.id) return data({ error: "These are the examples themselves; pick another lab.", about: "copy" }, { status: 400 });
    await copyExamples(db(), { fromLabId: from.lab.id, fromName: from.lab.name, toLabId: to.id, actorId: user.id });
    session.set("labSlug", to.slug);
    throw redirect(`/labs/${to.slug}/networks`, { headers: { "Set-Cookie": await commitSession(session) } });
  }
  if (intent !== "create") return data({ error: "Unknown action." }, { status: 400 });
  const name = parseLabName(field(form, "name"));
  if (!name.ok) return data({ error: name.message }, { status: 400 });
  const lab = await createLab(db(), { userId: user.id, name: name.value });
  session.set("labSlug", lab.slug);
  throw redirect(`/labs/${lab.slug}`, { headers: { "Set-Cookie": await commitSession(session) } });
}

export default function Labs({ loaderData, actionData }: Route.ComponentProps) {
  const { labs, activeSlug, publicLabs, networkCount } = loaderData;
  const working = labs.find((l) => l.slug === activeSlug) ?? null;
  return (
    <div className="space-y-8">
      <header>
        <h1 className="text-2xl font-semibold tracking-tight">Your labs</h1>
        <p className="mt-1 text-muted">A lab is a shared workspace: its members see its networks and analyses according to their role.</p>
      </header>
      {networkCount === 0 && <FirstSteps examples={publicLabs[0] ?? null} workingLab={working && working.role !== "viewer" ? working : null} />}
      {actionData && "about" in actionData && <FormMessage result={actionData} />}
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
      {publicLabs.length > 0 && (
        <section aria-labelledby="examples-title" className="space-y-3">
          <h2 id="examples-title" className="font-semibold">
            Open to everyone
          </h2>
          <ul className="grid gap-3 md:grid-cols-2" data-testid="public-labs">
            {publicLabs.map((lab) => (
              <li key={lab.id} className="card flex flex-wrap items-center justify-between gap-4 p-4">
                <div>
                  <Link to={`/labs/${lab.slug}/networks`} className="font-medium text-ink hover:text-accent">
                    {lab.name}
                  </Link>
                  <p className="mt-1 text-xs text-muted">
                    {lab.networkCount} network{lab.networkCount === 1 ? "" : "s"} · read only for everyone signed in
                  </p>
                </div>
                <CopyExamplesButton from={lab.slug} />
              </li>
            ))}
          </ul>
        </section>
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
        {actionData && !("about" in actionData) && <FormMessage result={actionData} />}
        <button type="submit" className="btn-primary">
          Create lab
        </button>
      </Form>
    </div>
  );
}

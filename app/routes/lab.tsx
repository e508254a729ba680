import { data, Form, Link, redirect } from "react-router";
import type { Route } from "./+types/lab";
import { db } from "~/db.server";
import { listMembers } from "~/labs/memberships.server";
import { runLeave, runRename } from "~/labs/lab-actions.server";
import { field } from "~/shared/form";
import { FormMessage, inputClass, RoleBadge } from "~/labs/ui";
import { CopyExamplesButton } from "~/labs/first-steps";
import { assertLabRole, requireLabMember, requireLabRole } from "~/permissions/permissions.server";
import { hasRole, ROLE_DESCRIPTIONS } from "~/permissions/roles";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.lab.name ?? "Lab"} · Stillpoint` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  // Guests of a public lab see what it holds, not who is in it.
  if (access.guest) return { lab: access.lab, role: access.role, guest: true, memberCount: 0, owners: [] as string[] };
  const members = await listMembers(db(), access.lab.id);
  return { lab: access.lab, role: access.role, guest: false, memberCount: members.length, owners: members.filter((m) => m.role === "owner").map((m) => m.displayName) };
}

/** intent=rename (owner) or intent=leave (any member but the last owner). */
export async function action({ request, params }: Route.ActionArgs) {
  const access = requireLabMember(await requireLabRole(request, params.labSlug, "viewer"));
  const form = await request.formData();
  const intent = field(form, "intent");
  if (intent === "rename") {
    assertLabRole(access, "owner");
    const result = await runRename(access, form);
    return data(result, { status: result.status });
  }
  if (intent === "leave") {
    const result = await runLeave(access);
    if (result.error) return data(result, { status: result.status });
    throw redirect("/labs");
  }
  return data({ status: 400, error: "Unknown action." }, { status: 400 });
}

export default function LabPage({ loaderData, actionData }: Route.ComponentProps) {
  const { lab, role, memberCount, owners, guest } = loaderData;
  const isOwner = hasRole(role, "owner");
  if (guest) return <GuestLabPage lab={lab} />;
  return (
    <div className="space-y-8">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-sm text-muted">Lab</p>
          <h1 className="text-2xl font-semibold tracking-tight" data-testid="lab-name">
            {lab.name}
          </h1>
          <p className="mt-2 flex items-center gap-2 text-sm text-muted">
            You are <RoleBadge role={role} /> — {ROLE_DESCRIPTIONS[role]}
          </p>
        </div>
        <nav className="flex gap-2 text-sm">
          <Link to={`/labs/${lab.slug}/members`} className="btn-quiet">
            Members ({memberCount})
          </Link>
          {isOwner && (
            <Link to={`/labs/${lab.slug}/audit`} className="btn-quiet">
              Audit log
            </Link>
          )}
        </nav>
      </header>
      <p className="text-sm text-muted">Owners: {owners.join(", ")}</p>
      <FormMessage result={actionData} />
      {isOwner && (
        <Form method="post" className="card flex max-w-lg items-end gap-3">
          <input type="hidden" name="intent" value="rename" />
          <label className="flex-1 space-y-1 text-sm font-medium">
            Lab name
            <input name="name" defaultValue={lab.name} required maxLength={120} className={inputClass} />
          </label>
          <button type="submit" className="btn-quiet">
            Rename
          </button>
        </Form>
      )}
      <Form method="post">
        <input type="hidden" name="intent" value="leave" />
        <button type="submit" className="text-sm text-danger hover:underline">
          Leave this lab
        </button>
      </Form>
    </div>
  );
}

/** A public lab as a guest sees it: what it is for, its networks, and the way to work on copies. */
function GuestLabPage({ lab }: { lab: { slug: string; name: string } }) {
  return (
    <div className="space-y-6">
      <header>
        <p className="text-sm text-muted">Open to everyone signed in</p>
        <h1 className="text-2xl font-semibold tracking-tight" data-testid="lab-name">
          {lab.name}
        </h1>
        <p className="mt-2 max-w-prose text-sm text-muted">
          You read this lab as a guest: every network, version and download is open to you, nothing can be changed, and analyses
          run in your own lab. Copy the examples there to edit and analyse them.
        </p>
      </header>
      <div className="flex flex-wrap items-center gap-3">
        <Link to={`/labs/${lab.slug}/networks`} className="btn-primary">
          See the networks
        </Link>
        <CopyExamplesButton from={lab.slug} />
      </div>
    </div>
  );
}

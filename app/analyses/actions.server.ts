/**
 * The analysis page's form actions, each with its own role: cancel and follow-ups (editor), name
 * and note (editor), archive (editor), delete and share links (owner). The route has already
 * checked sign-in and lab membership; every intent checks its role before it reads the form further.
 */
import { data, redirect } from "react-router";
import { getEnv } from "~/env.server";
import { assertLabRole, type LabAccess } from "~/permissions/permissions.server";
import { recordRunAudit, runDetails } from "./audit.server";
import { formObject } from "~/shared/form";
import { notFound } from "~/shared/responses";
import { analysesPath, sharePath } from "./paths";
import { findJob, type JobRecord } from "./repository.server";
import { deleteRun, parseRunDetails, setRunArchived, setRunDetails } from "./runs.server";
import type { DbExecutor } from "~/db/schema";
import { cancelJob, startFollowUp } from "./service.server";
import { createShareLink, revokeShareLink, SHARE_DAYS } from "./share.server";

const problem = (field: string, message: string, status = 400) => data({ problems: [{ field, message }] }, { status });

export async function runAnalysisAction(db: DbExecutor, access: LabAccess, job: JobRecord, form: FormData) {
  const intent = String(form.get("intent") ?? "");
  switch (intent) {
    case "cancel": {
      assertLabRole(access, "editor");
      const target = String(form.get("jobId") ?? job.id);
      const victim = target === job.id ? job : await findJob(db, access.lab.id, target);
      if (!victim || (victim.id !== job.id && victim.parent_id !== job.id)) throw notFound();
      return { status: await cancelJob(db, access, victim) };
    }
    case "relation":
    case "scan":
    case "timecourse": {
      assertLabRole(access, "editor");
      const input = formObject(form);
      if (intent === "scan") {
        const [kind, name] = String(form.get("parameterChoice") ?? "").split(":");
        Object.assign(input, { parameterKind: kind, parameter: name });
      }
      const outcome = await startFollowUp(db, access, job, intent, input);
      if (!outcome.ok) return data({ problems: outcome.problems }, { status: 400 });
      return { started: outcome.job.id };
    }
    case "details": {
      assertLabRole(access, "editor");
      const parsed = parseRunDetails({ name: form.get("name"), note: form.get("note") });
      if (!parsed.ok) return data({ problems: parsed.problems }, { status: 400 });
      await setRunDetails(db, job.id, { name: parsed.name, note: parsed.note });
      if (parsed.name !== job.name) await recordRunAudit(db, access, "analysis.renamed", { ...runDetails(job), from: job.name, to: parsed.name });
      if (parsed.note !== job.note) await recordRunAudit(db, access, "analysis.note_changed", { ...runDetails({ ...job, name: parsed.name }) });
      return { saved: "details" as const };
    }
    case "archive":
    case "unarchive": {
      assertLabRole(access, "editor");
      const archive = intent === "archive";
      if (archive === (job.archived_at !== null)) return { saved: intent };
      await setRunArchived(db, job.id, archive);
      await recordRunAudit(db, access, archive ? "analysis.archived" : "analysis.unarchived", runDetails(job));
      return { saved: intent };
    }
    case "delete": {
      assertLabRole(access, "owner");
      const deleted = await deleteRun(db, job.id);
      if (!deleted.ok) return problem("delete", deleted.message, 409);
      await recordRunAudit(db, access, "analysis.deleted", runDetails(job));
      throw redirect(analysesPath(access.lab.slug));
    }
    case "share-create": {
      assertLabRole(access, "owner");
      const days = Number(form.get("days") || SHARE_DAYS.default);
      if (!Number.isInteger(days) || days < 1 || days > SHARE_DAYS.max) return problem("days", `expected 1 to ${SHARE_DAYS.max} days`);
      const link = await createShareLink(db, job.id, access.user.id, days);
      await recordRunAudit(db, access, "analysis.share_link_created", { ...runDetails(job), linkId: link.id, days });
      return { shareLink: { url: `${getEnv().appUrl}${sharePath(link.token)}`, expiresAt: link.expiresAt.toISOString() } };
    }
    case "share-revoke": {
      assertLabRole(access, "owner");
      const linkId = String(form.get("linkId") ?? "");
      if (!/^[0-9a-f-]{36}$/i.test(linkId) || !(await revokeShareLink(db, job.id, linkId))) throw notFound();
      await recordRunAudit(db, access, "analysis.share_link_revoked", { ...runDetails(job), linkId });
      return { revoked: linkId };
    }
    default:
      return problem("intent", `unknown action '${intent}'`);
  }
}

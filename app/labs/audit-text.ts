/**
 * Audit events as sentences for people ("Ada Quill started a steady-state analysis of Kinase
 * loop v3"), from the names each event stored when it happened. Events written before a detail
 * existed still read, with a vaguer noun. Kinds not listed here fall back to their dotted name.
 */
import type { Json, JsonObject } from "~/db/schema";

export interface AuditLine {
  kind: string;
  actorName: string | null;
  details: JsonObject;
}

const str = (v: Json | undefined): string | null => (typeof v === "string" && v !== "" ? v : null);
const num = (v: Json | undefined): number | null => (typeof v === "number" ? v : null);
const quoted = (s: string) => `“${s}”`;

const JOB_NOUN: Record<string, string> = {
  analysis: "a steady-state analysis",
  scan: "a parameter scan",
  relation: "a relation test",
  timecourse: "a time course",
};

/** "Kinase loop v3" (or "a network" when the event predates the names). */
function networkText(d: JsonObject): string {
  const name = str(d.networkName) ?? str(d.name);
  const version = num(d.version);
  if (!name) return "a network";
  return version !== null ? `${name} v${version}` : name;
}

/** "the analysis “Dose series” of Kinase loop v3" / "the analysis of Kinase loop v3". */
function runText(d: JsonObject, name: string | null = str(d.name)): string {
  const of = str(d.networkName) ? ` of ${networkText(d)}` : "";
  return `the analysis${name ? ` ${quoted(name)}` : ""}${of}`;
}

function what(e: AuditLine): string | null {
  const d = e.details;
  const email = str(d.email);
  switch (e.kind) {
    case "auth.signed_in":
      return "signed in";
    case "auth.account_created":
      return "created an account";
    case "auth.signed_out_everywhere":
      return "signed out on every device";
    case "lab.created":
      return `created the lab ${quoted(str(d.name) ?? "?")}`;
    case "lab.renamed":
      return `renamed the lab from ${quoted(str(d.from) ?? "?")} to ${quoted(str(d.to) ?? "?")}`;
    case "membership.role_changed":
      return `changed the role of ${email ?? "a member"} from ${str(d.from) ?? "?"} to ${str(d.to) ?? "?"}`;
    case "membership.removed":
      return `removed ${email ?? "a member"} from the lab`;
    case "membership.left":
      return "left the lab";
    case "invitation.sent":
      return `invited ${email ?? "someone"}${str(d.role) ? ` as ${str(d.role)}` : ""}`;
    case "invitation.resent":
      return `sent the invitation to ${email ?? "someone"} again`;
    case "invitation.revoked":
      return `withdrew the invitation to ${email ?? "someone"}`;
    case "invitation.accepted":
      return `accepted the invitation${str(d.role) ? ` as ${str(d.role)}` : ""}`;
    case "api_token.created":
      return `created the API token ${quoted(str(d.name) ?? "?")}`;
    case "api_token.revoked":
      return `revoked the API token ${quoted(str(d.name) ?? "?")}`;
    case "network.created":
      return `uploaded the network ${str(d.name) ?? "?"}`;
    case "network.version_saved":
      return `saved version ${num(d.version) ?? "?"} of ${str(d.name) ?? "a network"}${str(d.changeNote) ? ` (${str(d.changeNote)})` : ""}`;
    case "network.deleted":
      return `deleted the network ${str(d.name) ?? "?"} with its versions and analyses`;
    case "analysis.started": {
      const noun = JOB_NOUN[str(d.jobKind) ?? "analysis"] ?? "a job";
      return `started ${noun}${str(d.name) ? ` ${quoted(str(d.name)!)}` : ""} of ${networkText(d)}`;
    }
    case "analysis.cancelled": {
      const kind = str(d.jobKind) ?? "analysis";
      const noun = kind === "analysis" ? runText(d) : `${(JOB_NOUN[kind] ?? "a job").replace(/^an? /, "the ")} of ${networkText(d)}`;
      return `cancelled ${noun}`;
    }
    case "analysis.renamed":
      return `renamed ${runText(d, null)} from ${str(d.from) ? quoted(str(d.from)!) : "no name"} to ${str(d.to) ? quoted(str(d.to)!) : "no name"}`;
    case "analysis.note_changed":
      return `changed the note on ${runText(d)}`;
    case "analysis.archived":
      return `archived ${runText(d)}`;
    case "analysis.unarchived":
      return `took ${runText(d)} out of the archive`;
    case "analysis.deleted":
      return `deleted ${runText(d)} with its scans, tests and time courses`;
    case "analysis.share_link_created":
      return `made a read-only link to ${runText(d)}${num(d.days) !== null ? `, valid ${num(d.days)} day${num(d.days) === 1 ? "" : "s"}` : ""}`;
    case "analysis.share_link_revoked":
      return `revoked a read-only link to ${runText(d)}`;
    case "analysis.limits_changed":
      return `set the lab's analysis limits to ${num(d.maxTimeLimitSeconds) ?? "?"} s and ${num(d.maxBasisSize) ?? "?"} polynomials`;
    default:
      return null;
  }
}

/** One sentence per event; the actor is "A former member" once their account is gone. */
export function auditSentence(e: AuditLine): string {
  const actor = e.actorName ?? "A former member";
  const text = what(e);
  return text ? `${actor} ${text}.` : `${actor}: ${e.kind}.`;
}

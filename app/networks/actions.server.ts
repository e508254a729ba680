/** The network page's form actions (details, archive, restore, delete), each with its own role. */
import { data, redirect } from "react-router";
import type { Kysely } from "kysely";
import type { Database } from "~/db/schema";
import { assertLabRole, type LabAccess } from "~/permissions/permissions.server";
import { deleteNetwork, setArchived, updateNetworkDetails, type NetworkRecord } from "./networks.server";
import { networkPath } from "./pages.server";
import { parseDetails, restoreVersion } from "./save.server";

export type NetworkActionResult = { error?: string; notice?: string; fields?: Record<string, string> };

export async function runNetworkAction(db: Kysely<Database>, access: LabAccess, network: NetworkRecord, form: FormData) {
  const intent = String(form.get("intent") ?? "");
  const page = networkPath(access.lab.slug, network.id);
  switch (intent) {
    case "details": {
      assertLabRole(access, "editor");
      const parsed = parseDetails({ name: form.get("name"), description: form.get("description"), tags: form.get("tags") });
      if (!parsed.ok) return data<NetworkActionResult>({ error: parsed.message, fields: parsed.details?.fields }, { status: 400 });
      await updateNetworkDetails(db, network.id, parsed.details);
      return data<NetworkActionResult>({ notice: "Details saved." });
    }
    case "archive":
    case "unarchive": {
      assertLabRole(access, "editor");
      await setArchived(db, network.id, intent === "archive");
      return data<NetworkActionResult>({ notice: intent === "archive" ? "Archived: hidden from the list until shown with “Show archived”." : "Back in the list." });
    }
    case "restore": {
      assertLabRole(access, "editor");
      const result = await restoreVersion(db, network, { authorId: access.user.id, number: Number(form.get("number")) });
      if (!result.ok) return data<NetworkActionResult>({ error: result.message }, { status: result.code === "not_found" ? 404 : 409 });
      throw redirect(`${page}?v=${result.version.number}`);
    }
    case "delete": {
      assertLabRole(access, "owner");
      if (String(form.get("confirmName") ?? "").trim() !== network.name) {
        return data<NetworkActionResult>({ error: "Type the network's exact name to confirm deleting it." }, { status: 400 });
      }
      await deleteNetwork(db, network, access.user.id);
      throw redirect(`/labs/${access.lab.slug}/networks`);
    }
    default:
      return data<NetworkActionResult>({ error: "Unknown action." }, { status: 400 });
  }
}

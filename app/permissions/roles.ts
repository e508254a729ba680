import type { LabRole } from "~/db/schema";

export type { LabRole };

/** Higher rank can do everything a lower rank can: owner ⊃ editor ⊃ viewer. */
const RANK: Record<LabRole, number> = { viewer: 1, editor: 2, owner: 3 };

export function isLabRole(value: unknown): value is LabRole {
  return value === "owner" || value === "editor" || value === "viewer";
}

/** True when `role` grants at least what `min` grants (e.g. owner satisfies editor). */
export function hasRole(role: LabRole, min: LabRole): boolean {
  return RANK[role] >= RANK[min];
}

/** What each role may do, in the words the interface shows. */
export const ROLE_DESCRIPTIONS: Record<LabRole, string> = {
  owner: "Manages members and the lab, and can do everything an editor can.",
  editor: "Uploads networks, runs analyses and edits.",
  viewer: "Reads and exports.",
};

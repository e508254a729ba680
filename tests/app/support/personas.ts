/**
 * The visitors every permission matrix is run as:
 *   anonymous · viewer · editor · owner of the lab under test · outsider (owner of another lab) · site admin (no lab)
 */
export const PERSONAS = ["anonymous", "viewer", "editor", "owner", "outsider", "admin"] as const;
export type Persona = (typeof PERSONAS)[number];
export type Expect = Record<Persona, number>;

/** Expected statuses for a lab resource that needs at least role `min`: outsiders and admins get 404 (no existence leak). */
export const labMember = (ok: number, min: "viewer" | "editor" | "owner", anon = 302): Expect => ({
  anonymous: anon,
  viewer: min === "viewer" ? ok : 403,
  editor: min === "owner" ? 403 : ok,
  owner: ok,
  outsider: 404,
  admin: 404,
});

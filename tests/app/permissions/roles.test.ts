import { describe, expect, it } from "vitest";
import { hasRole, isLabRole } from "~/permissions/roles";

describe("lab roles", () => {
  it("orders owner ⊃ editor ⊃ viewer", () => {
    const table = (["viewer", "editor", "owner"] as const).map((role) => [role, hasRole(role, "viewer"), hasRole(role, "editor"), hasRole(role, "owner")]);
    expect(table).toEqual([
      ["viewer", true, false, false],
      ["editor", true, true, false],
      ["owner", true, true, true],
    ]);
  });

  it("recognises only the three role names", () => {
    expect(["owner", "editor", "viewer"].every(isLabRole)).toBe(true);
    expect(["admin", "Owner", "", undefined, 3].some(isLabRole)).toBe(false);
  });
});

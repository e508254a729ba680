import { describe, expect, it } from "vitest";
import { field, formObject, ok, refuse } from "~/shared/form";

describe("form helpers", () => {
  const form = new FormData();
  form.set("name", "Kinetics");
  form.set("file", new Blob(["x"]), "a.csv");

  it("reads text fields, and a missing or file field as empty text", () => {
    expect(field(form, "name")).toBe("Kinetics");
    expect(field(form, "file")).toBe("");
    expect(field(form, "absent")).toBe("");
  });
  it("keeps only the text fields in the plain object", () => {
    expect(formObject(form)).toEqual({ name: "Kinetics" });
  });
  it("builds the two action results", () => {
    expect(ok("Saved.")).toEqual({ status: 200, notice: "Saved." });
    expect(refuse(404, "No such member.")).toEqual({ status: 404, error: "No such member." });
  });
});

import { describe, expect, it } from "vitest";
import { auditSentence } from "~/labs/audit-text";

const run = { analysisId: "a1", jobKind: "analysis", parentId: null, networkId: "n1", networkName: "Kinase loop", version: 3, name: "" };

describe("audit events as sentences", () => {
  it("names the person, the verb and the run", () => {
    expect(auditSentence({ kind: "analysis.started", actorName: "Ada Quill", details: run })).toBe("Ada Quill started a steady-state analysis of Kinase loop v3.");
    expect(auditSentence({ kind: "analysis.started", actorName: "Ada Quill", details: { ...run, jobKind: "scan", parentId: "a0" } })).toBe("Ada Quill started a parameter scan of Kinase loop v3.");
    expect(auditSentence({ kind: "analysis.cancelled", actorName: "Ada Quill", details: { ...run, name: "Dose series" } })).toBe("Ada Quill cancelled the analysis “Dose series” of Kinase loop v3.");
    expect(auditSentence({ kind: "analysis.cancelled", actorName: "Ada Quill", details: { ...run, jobKind: "timecourse" } })).toBe("Ada Quill cancelled the time course of Kinase loop v3.");
    expect(auditSentence({ kind: "analysis.renamed", actorName: "Bo Lind", details: { ...run, from: "", to: "Dose series" } })).toBe("Bo Lind renamed the analysis of Kinase loop v3 from no name to “Dose series”.");
    expect(auditSentence({ kind: "analysis.archived", actorName: "Bo Lind", details: { ...run, name: "Dose series" } })).toBe("Bo Lind archived the analysis “Dose series” of Kinase loop v3.");
    expect(auditSentence({ kind: "analysis.deleted", actorName: null, details: run })).toBe("A former member deleted the analysis of Kinase loop v3 with its scans, tests and time courses.");
  });

  it("reads uploads, versions and lab events", () => {
    expect(auditSentence({ kind: "network.created", actorName: "Ada Quill", details: { networkId: "n1", name: "Kinase loop", version: 1 } })).toBe("Ada Quill uploaded the network Kinase loop.");
    expect(auditSentence({ kind: "network.version_saved", actorName: "Ada Quill", details: { networkId: "n1", name: "Kinase loop", version: 2, changeNote: "faster phosphatase" } })).toBe(
      "Ada Quill saved version 2 of Kinase loop (faster phosphatase).",
    );
    expect(auditSentence({ kind: "membership.role_changed", actorName: "Ada Quill", details: { email: "bo@lab.test", from: "viewer", to: "editor" } })).toBe(
      "Ada Quill changed the role of bo@lab.test from viewer to editor.",
    );
  });

  it("events from before the names were stored still read; unknown kinds fall back to their name", () => {
    expect(auditSentence({ kind: "analysis.share_link_created", actorName: "Ada Quill", details: { analysisId: "a1", linkId: "l1", days: 7 } })).toBe(
      "Ada Quill made a read-only link to the analysis, valid 7 days.",
    );
    expect(auditSentence({ kind: "something.new", actorName: "Ada Quill", details: {} })).toBe("Ada Quill: something.new.");
  });
});

import { gzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { decodeNetworkFile, formatProblem, readNetworkDocument, textFileProblem, tryParseNetworkCsv } from "@domain/network/index";

const bytes = (...parts: (string | number[])[]) => new Uint8Array(parts.flatMap((p) => (typeof p === "string" ? [...Buffer.from(p, "latin1")] : p)));
// A real binary file: gzip output of a network file (RFC 1952 header 1F 8B 08 …).
const gzipped = new Uint8Array(gzipSync(Buffer.from("reaction,rate\n" + "E + S <-> C,k1\n".repeat(200))));

describe("decodeNetworkFile", () => {
  it("passes UTF-8 text, accents and a byte-order mark included", () => {
    const r = decodeNetworkFile(new Uint8Array(Buffer.from("\uFEFFreaction,label\nA -> B,café ⇄ µ\n", "utf8")));
    expect(r).toEqual({ ok: true, text: "reaction,label\nA -> B,café ⇄ µ\n" });
  });

  it("answers a binary file with one problem naming the first binary byte", () => {
    const r = decodeNetworkFile(gzipped);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    // gzip's header: 1F 8B 08 00 …: byte 1 is the control character 0x1F.
    expect(r.problem).toMatchObject({ row: 1, message: "this is not a text file: binary content at byte 1 (0x1F, line 1)" });
  });

  it("locates binary content after text lines", () => {
    const r = decodeNetworkFile(bytes("reaction\nA -> B\nC", [0x00], " -> D\n"));
    expect(!r.ok && formatProblem(r.problem)).toBe(
      "line 3: this is not a text file: binary content at byte 18 (0x00, line 3); expected a text file in UTF-8, such as a CSV saved from a spreadsheet or a text editor",
    );
  });

  it("says which byte is not UTF-8 in a Latin-1 file", () => {
    // "Café" in Latin-1: é is the single byte 0xE9, which cannot start a UTF-8 sequence followed by " ".
    const r = decodeNetworkFile(bytes("reaction,label\nA -> B,Caf", [0xe9], "\n"));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problem.row).toBe(2);
    expect(r.problem.columnIndex).toBe(11);
    expect(r.problem.message).toBe(
      "the file is not UTF-8 text: byte 26 (0xE9, line 2, character 11) is not valid UTF-8, so the file is in another encoding (such as Latin-1 or Windows-1252)",
    );
  });

  it("rejects overlong and surrogate encodings (Unicode 15, table 3-7)", () => {
    expect(decodeNetworkFile(bytes("A", [0xc0, 0xaf])).ok).toBe(false); // overlong "/"
    expect(decodeNetworkFile(bytes("A", [0xed, 0xa0, 0x80])).ok).toBe(false); // U+D800
    expect(decodeNetworkFile(bytes("A", [0xf0, 0x9f, 0x98, 0x80])).ok).toBe(true); // U+1F600
  });

  it("names UTF-16 and ZIP workbooks", () => {
    const utf16 = decodeNetworkFile(new Uint8Array([0xff, 0xfe, ...Buffer.from("reaction", "utf16le")]));
    expect(!utf16.ok && utf16.problem.message).toMatch(/UTF-16/);
    const zip = decodeNetworkFile(bytes("PK", [3, 4, 20, 0, 6, 0]));
    expect(!zip.ok && zip.problem.message).toMatch(/ZIP archive/);
    expect(!zip.ok && zip.problem.expected).toBe("the sheet exported as CSV");
  });
});

describe("binary text reaching the parsers", () => {
  it("gives one problem for a binary file read as text, instead of a complaint per stray quote", () => {
    const text = Buffer.from(gzipped).toString("latin1");
    const r = tryParseNetworkCsv(text);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]!.message).toMatch(/^this is not a text file: binary content \(0x1F\) at line 1, character 1$/);
    // Nothing of the file's bytes is echoed back.
    expect(formatProblem(r.problems[0]!).length).toBeLessThan(200);
  });

  it("flags U+FFFD left by a lossy decode, with its line and character", () => {
    const text = new TextDecoder().decode(bytes("reaction\nCaf", [0xe9], " -> B\n"));
    expect(textFileProblem(text)).toMatchObject({ row: 2, columnIndex: 4 });
    const r = readNetworkDocument(text, "text");
    expect(!r.ok && r.problems.map((p) => p.message)).toEqual([expect.stringMatching(/U\+FFFD at line 2, character 4/)]);
  });

  it("leaves clean text alone", () => {
    expect(textFileProblem("reaction\tlabel\r\nA -> B\f\n")).toBeNull();
  });
});

/**
 * Is an uploaded file text at all? A network file must be UTF-8 text; a binary file (an image, a
 * workbook, a compiled program) or text in another encoding gets ONE located problem here instead
 * of dozens of CSV complaints that echo its bytes back.
 *
 * Binary: a C0 control character other than tab, line feed, vertical tab, form feed, carriage
 * return or escape (text files do not hold them; binary formats are full of them, NUL first of all).
 * Encoding: bytes that are not well-formed UTF-8 (Unicode 15, §3.9, table 3-7), or a UTF-16
 * byte-order mark. Offsets are 1-based bytes, lines and columns as an editor counts them.
 *
 * Example: decodeNetworkFile(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))
 * is { ok: false, problem: { row: 2, message: "this is not a text file: binary content at byte 7 (0x1A, line 2) …" } }.
 */
import type { NetworkFileProblem } from "./errors";

export type DecodedFile = { ok: true; text: string } | { ok: false; problem: NetworkFileProblem };

const EXPECTED_TEXT = "a text file in UTF-8, such as a CSV saved from a spreadsheet or a text editor";
const hex = (b: number) => `0x${b.toString(16).toUpperCase().padStart(2, "0")}`;
const isBinaryControl = (c: number) => c <= 0x08 || (c >= 0x0e && c <= 0x1f && c !== 0x1b) || c === 0x7f;

/** Decodes a file's bytes as UTF-8 text (a UTF-8 byte-order mark dropped), or says in one problem why it is not. */
export function decodeNetworkFile(bytes: Uint8Array): DecodedFile {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return { ok: false, problem: { row: 1, message: "the file is UTF-16 text (it starts with a UTF-16 byte-order mark), not UTF-8", expected: "the file saved again as UTF-8 (“CSV UTF-8” in most spreadsheets)" } };
  }
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) {
    return { ok: false, problem: { row: 1, message: "this is not a text file: it is a ZIP archive (an .xlsx or .ods workbook is one)", expected: "the sheet exported as CSV" } };
  }
  let line = 1;
  let lineStart = 0;
  let invalid: { at: number; line: number; column: number; byte: number } | null = null;
  for (let i = 0; i < bytes.length; ) {
    const b = bytes[i]!;
    if (isBinaryControl(b)) {
      return { ok: false, problem: { row: line, message: `this is not a text file: binary content at byte ${i + 1} (${hex(b)}, line ${line})`, expected: EXPECTED_TEXT } };
    }
    const length = utf8SequenceLength(bytes, i);
    if (length === 0) {
      invalid ??= { at: i, line, column: charsBetween(bytes, lineStart, i) + 1, byte: b };
      i += 1;
      continue;
    }
    if (b === 0x0a || (b === 0x0d && bytes[i + 1] !== 0x0a)) {
      line += 1;
      lineStart = i + 1;
    }
    i += length;
  }
  if (invalid) {
    return {
      ok: false,
      problem: {
        row: invalid.line,
        columnIndex: invalid.column,
        message: `the file is not UTF-8 text: byte ${invalid.at + 1} (${hex(invalid.byte)}, line ${invalid.line}, character ${invalid.column}) is not valid UTF-8, so the file is in another encoding (such as Latin-1 or Windows-1252)`,
        expected: "the file saved again as UTF-8 (“CSV UTF-8” in most spreadsheets)",
      },
    };
  }
  const text = new TextDecoder("utf-8").decode(bytes);
  return { ok: true, text };
}

/**
 * The same test on text already decoded (a JSON string, pasted text): a binary control character
 * means binary content; U+FFFD means a reader replaced bytes it could not decode. Null when clean.
 * Example: textFileProblem("reaction\nA\u0001 -> B") names line 2, character 2.
 */
export function textFileProblem(text: string): NetworkFileProblem | null {
  let line = 1;
  let column = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    column += 1;
    if (isBinaryControl(c)) {
      return { row: line, columnIndex: column, message: `this is not a text file: binary content (${hex(c)}) at line ${line}, character ${column}`, expected: EXPECTED_TEXT };
    }
    if (c === 0xfffd) {
      return {
        row: line,
        columnIndex: column,
        message: `the text holds U+FFFD at line ${line}, character ${column}, the mark a reader leaves for bytes it could not decode: the file was probably not UTF-8`,
        expected: "the file saved again as UTF-8 and uploaded as it is",
      };
    }
    if (c === 0x0a || (c === 0x0d && text.charCodeAt(i + 1) !== 0x0a)) {
      line += 1;
      column = 0;
    }
  }
  return null;
}

/** Bytes in the well-formed UTF-8 sequence starting at i, or 0 when none starts there (Unicode table 3-7). */
function utf8SequenceLength(bytes: Uint8Array, i: number): number {
  const b0 = bytes[i]!;
  if (b0 < 0x80) return 1;
  const cont = (k: number, lo = 0x80, hi = 0xbf) => i + k < bytes.length && bytes[i + k]! >= lo && bytes[i + k]! <= hi;
  if (b0 >= 0xc2 && b0 <= 0xdf) return cont(1) ? 2 : 0;
  if (b0 === 0xe0) return cont(1, 0xa0) && cont(2) ? 3 : 0;
  if ((b0 >= 0xe1 && b0 <= 0xec) || b0 === 0xee || b0 === 0xef) return cont(1) && cont(2) ? 3 : 0;
  if (b0 === 0xed) return cont(1, 0x80, 0x9f) && cont(2) ? 3 : 0;
  if (b0 === 0xf0) return cont(1, 0x90) && cont(2) && cont(3) ? 4 : 0;
  if (b0 >= 0xf1 && b0 <= 0xf3) return cont(1) && cont(2) && cont(3) ? 4 : 0;
  if (b0 === 0xf4) return cont(1, 0x80, 0x8f) && cont(2) && cont(3) ? 4 : 0;
  return 0;
}

/** Characters (code points) between two byte offsets of UTF-8, for a column number. */
function charsBetween(bytes: Uint8Array, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) if ((bytes[i]! & 0xc0) !== 0x80) n += 1;
  return n;
}

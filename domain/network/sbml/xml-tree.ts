import { XMLParser, XMLValidator } from "fast-xml-parser";

/** One XML element with its attributes, child elements, text and 1-based source line. */
export interface XmlElement {
  /** Local name (namespace prefixes removed). */
  readonly name: string;
  readonly attrs: Readonly<Record<string, string>>;
  /** Child elements in document order. */
  readonly children: readonly XmlElement[];
  /** Child items in document order, text included (MathML `<cn>` needs `1 <sep/> 3`). */
  readonly items: readonly (XmlElement | string)[];
  readonly line: number;
}

export type XmlReadResult =
  | { readonly ok: true; readonly root: XmlElement }
  | { readonly ok: false; readonly line: number; readonly message: string };

/**
 * Reads XML text into an ordered element tree with line numbers, using fast-xml-parser
 * (validation first, so malformed XML is reported with its line instead of half-read).
 *
 * Example: readXml('<a x="1"><b/></a>') gives root { name: "a", attrs: { x: "1" }, children: [b] }.
 */
export function readXml(text: string): XmlReadResult {
  const valid = XMLValidator.validate(text);
  if (valid !== true) return { ok: false, line: valid.err.line, message: `the file is not well-formed XML: ${valid.err.msg}` };
  const parser = new XMLParser({
    preserveOrder: true,
    ignoreAttributes: false,
    attributeNamePrefix: "",
    captureMetaData: true,
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
    removeNSPrefix: true,
    processEntities: true,
  });
  let raw: RawNode[];
  try {
    raw = parser.parse(text) as RawNode[];
  } catch (e) {
    // The parser's own limits (nesting depth, entity expansion) end here rather than as a crash.
    return { ok: false, line: 1, message: `the file cannot be read as XML: ${(e as Error).message}` };
  }
  const lineOf = lineIndex(text);
  const meta = XMLParser.getMetaDataSymbol() as unknown as symbol;
  const convert = (node: RawNode): XmlElement | string | null => {
    const name = Object.keys(node).find((k) => k !== ":@");
    if (name === undefined) return null;
    if (name === "#text") return String(node[name]);
    if (name.startsWith("?") || name === "#comment") return null;
    const items = (node[name] as RawNode[]).map(convert).filter((x): x is XmlElement | string => x !== null);
    const start = (node as unknown as Record<symbol, { startIndex?: number } | undefined>)[meta]?.startIndex ?? 0;
    return {
      name,
      attrs: (node[":@"] as Record<string, string> | undefined) ?? {},
      children: items.filter((x): x is XmlElement => typeof x !== "string"),
      items,
      line: lineOf(start),
    };
  };
  const roots = raw.map(convert).filter((x): x is XmlElement => x !== null && typeof x !== "string");
  if (roots.length !== 1) return { ok: false, line: 1, message: "the file has no single root element" };
  return { ok: true, root: roots[0] };
}

type RawNode = Record<string, unknown>;

/** Character offset → 1-based line number. */
function lineIndex(text: string): (offset: number) => number {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return (offset) => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
}

/** The first child named `name`, if any. */
export const child = (e: XmlElement, name: string): XmlElement | undefined => e.children.find((c) => c.name === name);

/** All children named `name` of the first child `list` (e.g. `listOfSpecies` → `species`). */
export const listed = (e: XmlElement | undefined, list: string, name: string): XmlElement[] =>
  (e === undefined ? undefined : child(e, list))?.children.filter((c) => c.name === name) ?? [];

/** Text content of an element (its text items joined). */
export const textOf = (e: XmlElement): string => e.items.filter((x): x is string => typeof x === "string").join(" ").trim();

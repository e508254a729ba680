import type { NetworkStructure, ReactionSummary } from "@domain/network/index";

/**
 * What changed between two versions of a network, reaction by reaction. Directed reactions are
 * matched by `reactant → product` (canonical complex texts), so reordering rows or writing
 * `A <-> B` instead of two one-way rows is not a change; a matched reaction whose rate symbol,
 * rate value or label differs is "changed".
 */
export interface ReactionChange {
  reaction: string;
  before: ReactionSummary;
  after: ReactionSummary;
  /** e.g. `rate symbol k1 → kon`, `rate value 2 → 5/2`, `label binding → (none)`. */
  changes: string[];
}

export interface NetworkDiff {
  speciesAdded: string[];
  speciesRemoved: string[];
  reactionsAdded: ReactionSummary[];
  reactionsRemoved: ReactionSummary[];
  reactionsChanged: ReactionChange[];
  /**
   * Species held constant or released, or held at another concentration, e.g.
   * `A held constant at 2`, `B held constant (symbolic)`, `A no longer held constant`, `A: 2 → 5/2`.
   * Holding a species also changes the reactions' complexes, which the lists above show.
   */
  constantsChanged: string[];
  /** Stored initial values set, removed or changed, e.g. `S = 10`, `S: 10 → 5`, `S: no initial value`. */
  initialChanged: string[];
  /** True when nothing above is non-empty. */
  identical: boolean;
}

/** `constants` may be missing from a structure stored before constant species existed. */
type Side = Pick<NetworkStructure, "species" | "reactionList"> & { constants?: NetworkStructure["constants"]; initial?: NetworkStructure["initial"] };

export const reactionText = (r: Pick<ReactionSummary, "reactant" | "product">) => `${r.reactant} → ${r.product}`;

export function diffNetworks(before: Side, after: Side): NetworkDiff {
  const speciesAdded = after.species.filter((s) => !before.species.includes(s));
  const speciesRemoved = before.species.filter((s) => !after.species.includes(s));
  // The same reaction may be listed twice; match the k-th copy with the k-th copy.
  const keyed = (list: ReactionSummary[]) => {
    const seen = new Map<string, number>();
    return list.map((r) => {
      const text = reactionText(r);
      const k = (seen.get(text) ?? 0) + 1;
      seen.set(text, k);
      return { key: `${text}#${k}`, r };
    });
  };
  const a = keyed(before.reactionList);
  const b = keyed(after.reactionList);
  const bByKey = new Map(b.map((x) => [x.key, x.r]));
  const aKeys = new Set(a.map((x) => x.key));
  const reactionsRemoved = a.filter((x) => !bByKey.has(x.key)).map((x) => x.r);
  const reactionsAdded = b.filter((x) => !aKeys.has(x.key)).map((x) => x.r);
  const reactionsChanged: ReactionChange[] = [];
  for (const { key, r: old } of a) {
    const now = bByKey.get(key);
    if (!now) continue;
    const changes: string[] = [];
    const show = (v: string | undefined) => v ?? "(none)";
    if (old.rate !== now.rate) changes.push(`rate symbol ${old.rate} → ${now.rate}`);
    if (old.rateValue !== now.rateValue) changes.push(`rate value ${show(old.rateValue)} → ${show(now.rateValue)}`);
    if (old.label !== now.label) changes.push(`label ${show(old.label)} → ${show(now.label)}`);
    const heldText = (h: Record<string, number> | undefined) => (h ? Object.entries(h).map(([sp, c]) => (c === 1 ? sp : `${c}${sp}`)).join(" + ") : undefined);
    if (heldText(old.held) !== heldText(now.held)) changes.push(`constant species consumed ${show(heldText(old.held))} → ${show(heldText(now.held))}`);
    if (changes.length > 0) reactionsChanged.push({ reaction: reactionText(now), before: old, after: now, changes });
  }
  const constantsChanged = diffConstants(before.constants ?? [], after.constants ?? []);
  const initialChanged = diffInitial(before.initial ?? [], after.initial ?? []);
  const identical = [speciesAdded, speciesRemoved, reactionsAdded, reactionsRemoved, reactionsChanged, constantsChanged, initialChanged].every((l) => l.length === 0);
  return { speciesAdded, speciesRemoved, reactionsAdded, reactionsRemoved, reactionsChanged, constantsChanged, initialChanged, identical };
}

function diffConstants(before: NetworkStructure["constants"], after: NetworkStructure["constants"]): string[] {
  const out: string[] = [];
  const held = (v: string | undefined) => v ?? "symbolic";
  for (const c of after) {
    const old = before.find((b) => b.name === c.name);
    if (!old) out.push(c.value ? `${c.name} held constant at ${c.value}` : `${c.name} held constant (symbolic)`);
    else if (old.value !== c.value) out.push(`${c.name}: ${held(old.value)} → ${held(c.value)}`);
  }
  for (const b of before) if (!after.some((c) => c.name === b.name)) out.push(`${b.name} no longer held constant`);
  return out;
}

function diffInitial(before: NonNullable<NetworkStructure["initial"]>, after: NonNullable<NetworkStructure["initial"]>): string[] {
  const out: string[] = [];
  for (const c of after) {
    const old = before.find((b) => b.name === c.name);
    if (!old) out.push(`${c.name} = ${c.value}`);
    else if (old.value !== c.value) out.push(`${c.name}: ${old.value} → ${c.value}`);
  }
  for (const b of before) if (!after.some((c) => c.name === b.name)) out.push(`${b.name}: no initial value`);
  return out;
}

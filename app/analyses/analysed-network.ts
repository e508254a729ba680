/**
 * The reactions an analysis was run on, with the rate values it used: the pinned version's
 * reactions, and for each rate constant the file's value, the run's override, or "symbolic".
 * Shown on the analysis page and on its share link, which grants exactly this analysis and so
 * this one version (never the network's other versions, description or authors).
 * Example: `A -> B,k,2` analysed numerically with rateValues { k: "3" } gives
 * [{ id: "r1", reaction: "A → B", rate: "k", fileValue: "2", usedValue: "3" }].
 */
import { formatRational } from "@domain/algebra/rational";
import { formatComplex, parseNetworkCsv } from "@domain/network/index";
import { networkFor } from "~/jobs/compute";
import type { AnalysisParams } from "./params";

export interface AnalysedReaction {
  id: string;
  label: string | null;
  reaction: string;
  rate: string;
  /** The value the network file gives, or null. */
  fileValue: string | null;
  /** The value the run used, or null when the rate stayed a symbol. */
  usedValue: string | null;
}

export interface AnalysedNetwork {
  reactions: AnalysedReaction[];
  constants: { name: string; fileValue: string | null; usedValue: string | null }[];
}

export function analysedNetwork(csv: string, params: Pick<AnalysisParams, "rateMode" | "rateValues">): AnalysedNetwork {
  const file = parseNetworkCsv(csv);
  const used = networkFor(csv, params);
  const text = (v: Parameters<typeof formatRational>[0] | undefined) => (v ? formatRational(v) : null);
  const side = (c: Parameters<typeof formatComplex>[0]) => formatComplex(c); // as the network page writes it
  return {
    reactions: file.reactions.map((r, i) => ({
      id: r.id,
      label: r.label ?? null,
      // Constant species are not part of the complexes; name the held reactants beside the reaction.
      reaction: `${side(r.reactant)} → ${side(r.product)}${r.held ? ` (held: ${formatComplex(r.held)})` : ""}`,
      rate: r.rate,
      fileValue: text(r.rateValue),
      usedValue: text(used.reactions[i]!.rateValue),
    })),
    constants: (file.constants ?? []).map((c, i) => ({ name: c.name, fileValue: text(c.value), usedValue: text(used.constants?.[i]?.value) })),
  };
}

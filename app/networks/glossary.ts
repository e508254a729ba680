/**
 * Plain-language help shown beside each term on the network page. Written for someone who knows
 * the chemistry but not the theory; definitions follow Feinberg's "Foundations of Chemical
 * Reaction Network Theory" (Springer, 2019) — common practice in the field.
 */
export const GLOSSARY = {
  reactions:
    "Each row of your file becomes one or two directed reactions: `A <-> B` is the pair A → B and B → A. Every directed reaction has its own rate constant; the same symbol on two reactions means one shared constant.",
  species:
    "The chemical kinds whose concentrations change over time, in the order they first appear in the file.",
  stoichiometricMatrix:
    "One row per species, one column per reaction. An entry says how many molecules of the species a single reaction event makes (positive) or uses up (negative). Every change the network can make is a combination of these columns.",
  complexes:
    "A complex is whatever stands on one side of an arrow, such as `E + S` or `2A`; `0` stands for nothing (inflow or outflow). Reactions connect complexes, so the network is a graph on them.",
  linkageClasses:
    "Linkage classes are the connected pieces of the complex graph, ignoring arrow directions. A strong linkage class is a set of complexes each reachable from every other along arrows; a terminal one has no arrow leaving it.",
  rank:
    "The rank s of the stoichiometric matrix: how many independent directions of change the reactions allow. Concentrations can only move within a space of this dimension.",
  deficiency:
    "The deficiency δ = n − ℓ − s counts complexes (n), minus linkage classes (ℓ), minus the rank (s). It is never negative. Small deficiency often means the network's steady states can be described without knowing the rate constants.",
  weakReversibility:
    "A network is weakly reversible when every reaction lies on a cycle of arrows: whenever you can go from one complex to another, you can also come back, maybe by a longer route.",
  theorems:
    "Two published theorems that decide, from the structure alone and for any positive rate constants, how many positive steady states each compatibility class can hold. Where one applies, the verdict card says so; where neither does, only an analysis with rate constants can count them.",
  deficiencyZero:
    "A theorem that decides, from structure alone, what the steady states look like when the deficiency is 0. The assumptions listed are part of the statement: it says nothing outside them.",
  deficiencyOne:
    "A companion theorem for networks whose linkage classes each have deficiency 0 or 1, adding up to the whole network's deficiency, with one terminal strong linkage class in each. Where it applies, no compatibility class holds more than one positive steady state, whatever the rate constants.",
  conservation:
    "A conservation law is a weighted sum of concentrations that no reaction changes, so it keeps its starting value forever. Each total is fixed by the initial concentrations, e.g. the enzyme is either free (E) or bound (C).",
  graph:
    "Complexes drawn as boxes and reactions as arrows; a line with arrowheads at both ends is a reversible pair, labelled with both rate constants (forward ⇄ backward). Each framed group is one linkage class.",
  odes:
    "Under mass-action kinetics each reaction runs at its rate constant times the concentrations of its reactant complex, each raised to its coefficient. A species' rate of change sums these over the reactions, times the net molecules made.",
} as const;

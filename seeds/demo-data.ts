/**
 * The invented demo scenario: the Halvorsen Enzyme Lab, a small group studying enzyme kinetics,
 * with one member per role and three small mass-action networks in Stillpoint's CSV format
 * (header `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value`, one reaction per row,
 * and a `# constant:` line for species held constant). Each network's `claims` state what its
 * texts say in a form tests/seeds/demo-data.test.ts checks against the engine.
 * All addresses use the reserved `.test` domain; mail to them lands in the local catcher.
 */
import type { LabRole } from "../app/db/schema";

export interface DemoPerson {
  email: string;
  displayName: string;
  role?: LabRole;
  isSiteAdmin?: boolean;
}

import type { DemoClaims } from "../app/networks/demos";

export interface DemoNetwork {
  name: string;
  description: string;
  /** Earlier demo descriptions of this network: a re-seed replaces them (and no text a person wrote). */
  previousDescriptions?: string[];
  tags: string[];
  claims?: DemoClaims;
  /** Oldest first; each becomes a numbered, content-hashed version. */
  versions: { csv: string; changeNote: string; author: string }[];
}

export const DEMO_LAB = { slug: "halvorsen-enzyme-lab", name: "Halvorsen Enzyme Lab" };

export const DEMO_PEOPLE: DemoPerson[] = [
  { email: "owner@halvorsen.test", displayName: "Ingrid Halvorsen", role: "owner" },
  { email: "editor@halvorsen.test", displayName: "Tomás Reyes", role: "editor" },
  { email: "viewer@halvorsen.test", displayName: "Mei Watanabe", role: "viewer" },
  { email: "admin@stillpoint.test", displayName: "Site Administrator", isSiteAdmin: true },
];

const csv = (...lines: string[]) => lines.join("\n") + "\n";
const HEADER = "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value";

export const DEMO_NETWORKS: DemoNetwork[] = [
  {
    name: "Invertase binding and turnover",
    description:
      "Enzyme E binds sucrose S reversibly into the complex C, which releases the product P. " +
      "The textbook two-step enzyme mechanism, with the lab's bench estimates as rate values.",
    tags: ["enzyme", "michaelis-menten", "teaching"],
    // The product only accumulates: no positive steady state in any class.
    claims: { deficiency: 0, weaklyReversible: false, steadyStates: { count: 0, stable: 0, initial: { E: "1", S: "1" } } },
    versions: [
      {
        author: "owner@halvorsen.test",
        changeNote: "First entry from the bench notebook.",
        csv: csv(HEADER, "E + S <-> C,binding,kon,koff,2,1", "C -> E + P,turnover,kcat,,3,"),
      },
    ],
  },
  {
    name: "Kinase–phosphatase cycle",
    description:
      "A substrate switched between its unphosphorylated form S0 and phosphorylated form S1 by a kinase K " +
      "and a phosphatase F, each acting through an enzyme–substrate complex.",
    tags: ["signalling", "phosphorylation"],
    // One-site cycle: one positive steady state per class for these rates (the class of S0 = 1, K = F = 1/2 checked).
    claims: { deficiency: 1, weaklyReversible: false, steadyStates: { count: 1, stable: 1, initial: { S0: "1", K: "1/2", F: "1/2" } } },
    versions: [
      {
        author: "editor@halvorsen.test",
        changeNote: "Kinase arm only, to check the fit of the binding constants.",
        csv: csv(HEADER, "S0 + K <-> S0K,kinase binding,a1,d1,1,1/2", "S0K -> S1 + K,phosphorylation,c1,,2,"),
      },
      {
        author: "editor@halvorsen.test",
        changeNote: "Added the phosphatase arm, closing the cycle.",
        csv: csv(
          HEADER,
          "S0 + K <-> S0K,kinase binding,a1,d1,1,1/2",
          "S0K -> S1 + K,phosphorylation,c1,,2,",
          "S1 + F <-> S1F,phosphatase binding,a2,d2,1,1",
          "S1F -> S0 + F,dephosphorylation,c2,,3/2,",
        ),
      },
    ],
  },
  {
    name: "Autocatalytic switch",
    description:
      "X makes more of itself from the feed A (two X help a third one form) and decays into the waste B. " +
      "The inflow holds A at 2 and the outflow holds B at 3 (both declared constant), so only X changes. " +
      "With these rates the reactor has three positive steady states, X = 1, 2 and 3: the outer two are stable " +
      "and the middle one is not, so the reactor is a bistable switch.",
    previousDescriptions: [
      "X makes more of itself from the feed A (two X help a third one form) and decays into the waste B. " +
        "With suitable rates the reactor has more than one positive steady state.",
    ],
    tags: ["bistability", "autocatalysis", "fed reactor"],
    // Schlögl's second model with reservoir species (Z. Physik 253, 1972): with A and B constant,
    // dX/dt = 3·2·X² − X³ − 11·X + 2·3 = −(X − 1)(X − 2)(X − 3) (expanded by hand).
    claims: { deficiency: 1, weaklyReversible: true, steadyStates: { count: 3, stable: 2, concentrations: [{ X: 1 }, { X: 2 }, { X: 3 }] } },
    versions: [
      {
        author: "owner@halvorsen.test",
        changeNote: "Reactor model as sketched at the group meeting.",
        csv: csv(HEADER, "A + 2X <-> 3X,autocatalysis,k1,k2,1,1", "X <-> B,decay,k3,k4,1,1"),
      },
      {
        author: "owner@halvorsen.test",
        changeNote:
          "Feed A and waste B held constant by the inflow and outflow (as closed, the model was deficiency zero and weakly reversible: one steady state per class, no switch); rate values from the reactor runs.",
        csv: csv("# constant: A = 2, B = 3", HEADER, "A + 2X <-> 3X,autocatalysis,k1,k2,3,1", "X <-> B,decay,k3,k4,11,2"),
      },
    ],
  },
];

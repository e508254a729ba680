/**
 * The invented demo scenario: the Halvorsen Enzyme Lab, a small group studying enzyme kinetics,
 * with one member per role and three small mass-action networks in Stillpoint's CSV format
 * (header `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value`, one reaction per row).
 * All addresses use the reserved `.test` domain; mail to them lands in the local catcher.
 */
import type { LabRole } from "../app/db/schema";

export interface DemoPerson {
  email: string;
  displayName: string;
  role?: LabRole;
  isSiteAdmin?: boolean;
}

export interface DemoNetwork {
  name: string;
  description: string;
  tags: string[];
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
      "With suitable rates the reactor has more than one positive steady state.",
    tags: ["bistability", "autocatalysis"],
    versions: [
      {
        author: "owner@halvorsen.test",
        changeNote: "Reactor model as sketched at the group meeting.",
        csv: csv(HEADER, "A + 2X <-> 3X,autocatalysis,k1,k2,1,1", "X <-> B,decay,k3,k4,1,1"),
      },
    ],
  },
];

/**
 * Starting points for a new network, in invented scenarios (our CSV format). Each is small
 * enough to read at a glance and shows a different structural feature.
 */
/**
 * What a demo's texts say about it, in a form the engine can check (tests/seeds/demo-data.test.ts
 * and tests/app/networks/demos.test.ts compare every claim with the engine's own verdict). A text
 * that speaks of several steady states or a switch must carry a steady-state claim.
 */
export interface DemoClaims {
  deficiency?: number;
  weaklyReversible?: boolean;
  /** Positive steady states for the file's values (in the class of `initial` when something is conserved). */
  steadyStates?: { count: number; stable: number; initial?: Record<string, string>; concentrations?: Record<string, number>[] };
}

export interface DemoNetwork {
  id: string;
  title: string;
  summary: string;
  csv: string;
  claims?: DemoClaims;
}

export const DEMO_NETWORKS: DemoNetwork[] = [
  {
    id: "binding-release",
    title: "Enzyme binding and release",
    summary: "An enzyme E binds a substrate S into a complex C that releases product P. Deficiency 0, not weakly reversible.",
    csv: "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,binding,kon,koff,2,1\nC -> E + P,release,kcat,,3,\n",
  },
  {
    id: "three-state-channel",
    title: "Three-state channel",
    summary: "A membrane channel cycling closed → open → inactive → closed, each step reversible. Deficiency 0, weakly reversible.",
    csv: "reaction,rate,reverse_rate\nClosed <-> Open,a1,b1\nOpen <-> Inactive,a2,b2\nInactive <-> Closed,a3,b3\n",
  },
  {
    id: "feed-and-flush",
    title: "Feed, dimerise, flush",
    summary: "A monomer M is fed in, pairs into a dimer D, and both are washed out. Inflow and outflow through the zero complex; deficiency 1.",
    csv: "reaction,label,rate,reverse_rate\n0 <-> M,feed and flush,f,d1\n2M <-> D,dimerisation,kd,ku\nD -> 0,flush dimer,d2,\n",
  },
  {
    id: "fed-switch",
    title: "Fed autocatalytic switch",
    summary:
      "The feed A and the waste B are held constant; X makes more of itself from A and decays into B. With these rates: three positive steady states, two of them stable (a bistable switch). Deficiency 1, weakly reversible.",
    csv: "# constant: A = 2, B = 3\nreaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,autocatalysis,k1,k2,3,1\nX <-> B,decay,k3,k4,11,2\n",
    claims: { steadyStates: { count: 3, stable: 2 } },
  },
];

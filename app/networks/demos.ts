/**
 * Starting points for a new network, in invented scenarios (our CSV format). Each is small
 * enough to read at a glance and shows a different structural feature.
 */
export interface DemoNetwork {
  id: string;
  title: string;
  summary: string;
  csv: string;
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
];

/** The analysis stages in the words the pages use (the engine's stage ids stay in the stored result). */
const STAGE_LABELS: Record<string, string> = {
  parametrisation: "parametrisation",
  groebner: "full Gröbner basis",
  "steady-states": "positive steady states of the class",
  acr: "robust species (ACR)",
  relations: "relation tests",
  multistationarity: "multistationarity verdict",
};

export const stageLabel = (stage: string) => STAGE_LABELS[stage] ?? stage;

/** The reason the engine gives for a stage a stopped run had not finished (domain NOT_REACHED). */
export const isNotReached = (reason: string) => reason.startsWith("not finished: the run stopped");

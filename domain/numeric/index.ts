/** Floating-point numerics: eigenvalues, stability on a stoichiometric class, Newton, multistart search, stiff trajectories. */
export { type Matrix, type Vector, solveLinear, orthonormalColumnBasis, matMul, matVec, transpose, identity, zeros } from "./dense";
export { eigenvalues, EigenvalueError, type Complex } from "./eigenvalues";
export { restrictedJacobian, stabilityVerdict, stabilityOnClass, type StabilityVerdict, type StabilityReport } from "./stability";
export { newton, type SystemEvaluator, type NewtonOptions, type NewtonResult } from "./newton";
export { multistartPositiveSolutions, seededRandom, sameSolution, type MultistartOptions } from "./multistart";
export { integrateStiff, linearProblem, type OdeProblem, type IntegrateOptions, type Trajectory } from "./rosenbrock";

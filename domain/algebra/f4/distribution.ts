import { AlgebraError } from "../errors";
import type { Limits } from "../groebner/limits";
import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import { QQ } from "../field";
import { dehomogenisedBasis, homogenise, homogeniseInto, isPlainGrevlex, orderWithH } from "../groebner/homogenise";
import { PolynomialRing } from "../ring";
import type { ImageTracing, ModularImage, MultiModularInput } from "./multimodular";
import { canLift, encodeImageTrace, imageModPrime, liftPrimes, multiModularInput } from "./multimodular";

/**
 * Lets a caller spread a large multi-modular basis over Q over other machines (app/jobs/
 * coordinator.server.ts) while the engine stays synchronous and pure: groebnerBasis computes the
 * first image modulo a prime; if that took at least `thresholdMs`, it throws a DistributeRequest
 * carrying the plain-data input and that image. The caller computes the basis elsewhere (its
 * images, lift and proof), and runs the same computation again with the proven basis in `known`,
 * where groebnerBasis finds it by the input's key instead of computing it. Reduced bases are
 * unique, so the second run's result is the one the single-process path would give.
 */
export interface DistributionHook {
  readonly thresholdMs: number;
  /** By distributionKey: a proven basis (exact text, as groebnerBasis returns it), or null = compute it here. */
  readonly known: ReadonlyMap<string, readonly string[] | null>;
}

export class DistributeRequest extends Error {
  /** `firstTrace`: the F4 run learnt at the first prime (encodeImageTrace), for the workers to replay rather than each learn it. */
  constructor(readonly input: MultiModularInput, readonly firstImage: ModularImage, readonly firstImageMs: number, readonly firstTrace?: Uint8Array) {
    super(`Gröbner basis: the first image modulo a prime took ${firstImageMs} ms; asking to distribute it`);
    this.name = "DistributeRequest";
  }
}

/** The key of an input in DistributionHook.known: its exact text. */
export const distributionKey = (input: MultiModularInput): string => JSON.stringify([input.vars, input.order, input.polys, input.reference ?? null]);

/**
 * For groebnerBasis over Q in a degree-compatible order: the known basis, or a DistributeRequest
 * thrown when the first image is slow; null when the caller should go on as usual (known to be
 * computed here, not liftable, or quick).
 */
export function distributedOrLocal(polys: readonly Polynomial<Rational>[], limits: Limits, hook: DistributionHook): Polynomial<Rational>[] | null {
  const input = multiModularInput(polys);
  const key = distributionKey(input);
  if (hook.known.has(key)) {
    const basis = hook.known.get(key);
    if (!basis) return null;
    const ring = polys[0].ring;
    return basis.map((s) => ring.parse(s));
  }
  if (!canLift(input)) return null;
  const p = liftPrimes(input).next().value as number;
  const t0 = Date.now();
  // Learnt as it is computed (katsura-8: 455 ms against 422 ms untraced, bench/README), so that
  // the workers replay it instead of each learning it again.
  const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
  const image = imageModPrime(input, p, limits, { k: 1, of: 1 }, undefined, tracing);
  const ms = Date.now() - t0;
  // Whether the proof can succeed (step 3 by Hilbert functions) is the coordinator's first child
  // job, beside the images, so that check costs no time here.
  if (ms >= hook.thresholdMs) throw new DistributeRequest(input, image, ms, tracing.trace ? encodeImageTrace(input, tracing.trace) : undefined);
  return null;
}

export const isDistributeRequest = (e: unknown): e is DistributeRequest => e instanceof DistributeRequest && !(e instanceof AlgebraError);

/**
 * For a distributed grevlex basis whose proof step 3 failed (Hilbert functions need ⟨F^h⟩
 * saturated with respect to h, which saturated steady-state ideals, generator 1 − t·x1⋯xn, and
 * cyclic-n are not): the homogenised input F^h, whose step 3 is the homogeneous case, to
 * distribute instead, and `finish`, which turns its proven reduced basis into the reduced basis
 * of ⟨F⟩ (h = 1 and inter-reduction; groebner/homogenise.ts has the proof that this is the
 * reduced grevlex basis of ⟨F⟩). Null for other orders (lex and block orders prove step 3 by
 * membership and do not fail this way).
 */
export function homogenisedRoute(input: MultiModularInput): { input: MultiModularInput; finish: (basis: readonly string[], limits: Limits) => string[] } | null {
  if (input.reference) return null;
  const ring = new PolynomialRing(input.vars, QQ, input.order);
  if (!isPlainGrevlex(ring)) return null;
  const H = homogenise(input.polys.map((s) => ring.parse(s)));
  return {
    input: multiModularInput(H.polys, undefined, input.primeLimit),
    finish: (basis, limits) => dehomogenisedBasis(basis.map((s) => H.ring.parse(s)), ring, limits).map((g) => ring.format(g)),
  };
}

/**
 * Lex and block orders over Q, in one process or distributed: the homogenised grevlex basis R^h
 * (R = `reference`, proven) in >_h, whose reduced basis multi-modular F4 lifts and proves by
 * Hilbert series (multimodular.ts, `series`), and `finish`, which sets h = 1 and inter-reduces to
 * the reduced basis of ⟨F⟩ in the ring's order (groebner/homogenise.ts has why that is it).
 */
export function seriesRoute(ring: PolynomialRing<Rational>, reference: readonly Polynomial<Rational>[], primeLimit?: number): {
  polys: Polynomial<Rational>[];
  /** The plain-data input for a distributed run (built on demand: the one-process run needs only `polys`). */
  input: () => MultiModularInput;
  finish: (basis: readonly Polynomial<Rational>[], limits: Limits) => Polynomial<Rational>[];
} {
  const H = homogeniseInto(reference, orderWithH(ring));
  return {
    polys: H.polys,
    input: () => multiModularInput(H.polys, reference, primeLimit, true),
    finish: (basis, limits) => dehomogenisedBasis(basis, ring, limits),
  };
}

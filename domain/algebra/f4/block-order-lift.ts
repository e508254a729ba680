import type { Limits } from "../groebner/limits";
import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import type { F4Stats } from "./f4";
import { seriesRoute } from "./distribution";
import type { ImageTracing, LiftCandidate, MultiModularStats } from "./multimodular";
import {
  EARLY_PROOF_PRIMES, ImageLifter, candidateBasis, imageModPrime, isLiftPrime, liftPrimes, multiModularInput, proofBatches, proveBatch, provesDehomogenised,
} from "./multimodular";

/**
 * The reduced basis over Q of ⟨F⟩ in a lex or block order >, through I^h. Per prime, two F4 runs
 * degree by degree (f4/homogenised-image.ts; each learnt at the first prime and replayed): on the
 * homogenised grevlex basis R^h in >_h (f4/distribution.ts, `seriesRoute`), giving the reduced
 * basis of I^h mod p, and on F^h, giving that of I = ⟨F⟩ mod p. Both are lifted from the same primes:
 *  - I^h's, proven by Hilbert series (multimodular.ts, proveSeriesBatch): it fixes LM(I);
 *  - I's, the answer, proven against it (provesDehomogenised: leading monomials, reducedness,
 *    membership through R).
 * Why not only I^h's: h = 1 and inter-reduction of its proven basis over Q is exact but swells
 * (each fraction-free step scales the whole remainder by a leading coefficient of thousands of
 * bits; on the three-site cycle with k3, k6 symbolic it ran past 10 minutes), and h = 1 with
 * inter-reduction mod p at every prime cost more than the F^h image (0.6 s replayed, against
 * 0.28 s). Why not only I's: its proof by Buchberger's criterion was the wall (> 17 minutes
 * there). Small bases (I^h's proven within EARLY_PROOF_PRIMES primes) take h = 1 over Q, which is
 * then milliseconds, and never compute I's images.
 * Null when a proof fails twice (traced, then untraced) or the primes run out; `stats.failed` says which.
 */
export function blockOrderBasisQQ(
  F: readonly Polynomial<Rational>[],
  R: readonly Polynomial<Rational>[],
  limits: Limits,
  options: { readonly primeLimit?: number; readonly maxPrimes?: number; readonly stats?: MultiModularStats; readonly traced?: boolean } = {},
): Polynomial<Rational>[] | null {
  const stats: MultiModularStats = options.stats ?? { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
  const maxPrimes = options.maxPrimes ?? 2000;
  const ring = F[0].ring;
  const route = seriesRoute(ring, R, options.primeLimit);
  const hInput = route.input();
  const gInput = multiModularInput(F, R, options.primeLimit);
  const tick = () => limits.checkTime();
  const hLifter = new ImageLifter(hInput, tick), gLifter = new ImageLifter(gInput, tick);
  const traced = options.traced !== false;
  const tracing: ImageTracing | undefined = traced ? { trace: undefined, replayed: 0, declined: 0 } : undefined;
  const gTracing: ImageTracing | undefined = traced ? { trace: undefined, replayed: 0, declined: 0 } : undefined;
  const f4stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 };
  let proven: LiftCandidate | null = null, g: LiftCandidate | null = null;
  const early: number[] = [];
  let k = 0;
  const timed = <T>(key: "modularMs" | "proofMs", f: () => T): T => {
    const t0 = Date.now();
    try { return f(); } finally { stats[key] += Date.now() - t0; }
  };
  const provesSeries = (c: LiftCandidate) => timed("proofMs", () => proofBatches(hInput, c, 1).every((b) => proveBatch(hInput, c, b, limits).ok));
  for (const p of liftPrimes(hInput)) {
    if (k >= maxPrimes) { stats.failed = "primes"; return null; }
    limits.checkTime();
    k++;
    stats.primes = k;
    const image = timed("modularMs", () => imageModPrime(hInput, p, limits, { k, of: maxPrimes }, f4stats, tracing));
    if (!proven) {
      // A reconstruction from at most EARLY_PROOF_PRIMES primes is proven at once (cheaper than
      // another image on small bases); a wrong one fails and the lift goes on.
      const stable = hLifter.add(image);
      const c = stable ?? (k <= EARLY_PROOF_PRIMES ? hLifter.reconstructed() : null);
      if (c) {
        if (provesSeries(c)) proven = c;
        else if (stable) return failed("series");
        else hLifter.reject();
      }
      if (proven && k <= EARLY_PROOF_PRIMES) {
        // A small basis: h = 1 and inter-reduction over Q directly.
        stats.liftMs = hLifter.liftMs;
        return route.finish(candidateBasis(hInput, proven), limits);
      }
    }
    // I's images from the prime after EARLY_PROOF_PRIMES on, the earlier primes filled in then
    // (below it a small basis has finished through h = 1 over Q).
    if (k <= EARLY_PROOF_PRIMES) { early.push(p); continue; }
    for (const q of [...early.splice(0), p]) {
      if (g || !isLiftPrime(gInput, q)) continue;
      g = gLifter.add(timed("modularMs", () => imageModPrime(gInput, q, limits, { k, of: maxPrimes }, f4stats, gTracing)));
    }
    stats.unlucky = hLifter.unlucky;
    stats.liftMs = hLifter.liftMs + gLifter.liftMs;
    if (proven && g) {
      const candidate = g;
      if (timed("proofMs", () => provesDehomogenised(gInput, candidate, hInput, proven!, limits))) return candidateBasis(gInput, candidate);
      return failed("membership");
    }
  }
  stats.failed = "primes";
  return null;

  function failed(why: NonNullable<MultiModularStats["failed"]>): Polynomial<Rational>[] | null {
    stats.failed = why;
    // A replay can miss a row that reduces to zero only at the learning prime; the plain run cannot.
    if ((tracing && tracing.replayed > 0) || (gTracing && gTracing.replayed > 0)) return blockOrderBasisQQ(F, R, limits, { ...options, stats, traced: false });
    return null;
  }
}

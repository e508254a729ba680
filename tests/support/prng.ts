/**
 * Seeded pseudo-random numbers for reproducible property tests and generated fixtures:
 * mulberry32 (common practice), uniform in [0, 1), the same sequence on every run and machine.
 * domain/numeric/multistart.ts keeps its own copy because domain code cannot import tests.
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** An integer in [lo, hi] drawn from `rand`. */
export const randomInt = (rand: () => number, lo: number, hi: number): number => lo + Math.floor(rand() * (hi - lo + 1));

/** Seeded PRNG (mulberry32, public domain) so that random-input tests reproduce. */
export function prng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

export const mulberry32 = prng

export function between(r: () => number, lo: number, hi: number): number {
  return lo + (hi - lo) * r()
}

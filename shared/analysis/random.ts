// Seeded pseudo-random numbers so a pattern check can be repeated exactly.
// Hand-written because the generators must be splittable by simulation index (no npm PRNG offers that
// together with a 32-bit integer state that copies cheaply into worker threads).

export type Seed = number | string;
export type Random = () => number;

/** Turns a numeric or text seed into a 32-bit unsigned integer (FNV-1a for text). */
export function seedToUint32(seed: Seed): number {
  if (typeof seed === 'number') return (Math.trunc(seed) >>> 0) ^ ((seed / 4294967296) >>> 0);
  let h = 0x811c9dc5;
  for (let i = 0; i < seed.length; i++) {
    h ^= seed.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

/** splitmix32 finaliser: spreads nearby integers over the whole 32-bit range. */
function mix32(value: number): number {
  let z = (value + 0x9e3779b9) | 0;
  z = Math.imul(z ^ (z >>> 16), 0x21f0aaad);
  z = Math.imul(z ^ (z >>> 15), 0x735a2d97);
  return (z ^ (z >>> 15)) >>> 0;
}

/** The seed of stream `index` under a base seed; simulation i always draws from stream i. */
export function deriveSeed(seed: Seed, index: number): number {
  return mix32(seedToUint32(seed) ^ mix32(index + 1));
}

/** sfc32 generator (Doty-Humphrey's small fast counting PRNG) returning floats in [0, 1). */
export function createRandom(seed: Seed): Random {
  let a = mix32(seedToUint32(seed));
  let b = mix32(a ^ 0x6a09e667);
  let c = mix32(b ^ 0xbb67ae85);
  let d = 1;
  const next = (): number => {
    const t = (((a + b) | 0) + d) | 0;
    d = (d + 1) | 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) | 0;
    c = (c << 21) | (c >>> 11);
    c = (c + t) | 0;
    return (t >>> 0) / 4294967296;
  };
  for (let i = 0; i < 12; i++) next();
  return next;
}

/** Standard normal deviate by the Box–Muller transform (Box & Muller 1958). */
export function normalDeviate(random: Random): number {
  let u = random();
  while (u === 0) u = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
}

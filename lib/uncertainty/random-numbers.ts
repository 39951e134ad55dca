/**
 * A seeded pseudo-random source for Monte Carlo propagation: xoshiro128** (Blackman & Vigna, "Scrambled linear
 * pseudorandom number generators", ACM TOMS 47, 2021), seeded through splitmix32, with normal deviates by the
 * Box–Muller transform (JCGM 101:2008 §C.4). Internal: reports name the seed, so a run is reproduced exactly.
 */

/** A stream of deviates from one seed. */
export interface RandomSource {
  /** A uniform deviate in the open interval (0, 1). */
  uniform(): number;
  /** A standard normal deviate (mean 0, standard deviation 1). */
  normal(): number;
}

/** A xoshiro128** stream seeded from a whole number (any 32-bit value; other numbers are reduced modulo 2³²). */
export function randomSource(seed: number): RandomSource {
  let z = seed >>> 0;
  const next32 = (): number => {
    // splitmix32 (Steele, Lea & Flood 2014, 32-bit variant): spreads one seed over the four state words.
    z = (z + 0x9e3779b9) >>> 0;
    let t = z;
    t = Math.imul(t ^ (t >>> 16), 0x85ebca6b);
    t = Math.imul(t ^ (t >>> 13), 0xc2b2ae35);
    return (t ^ (t >>> 16)) >>> 0;
  };
  let s0 = next32(),
    s1 = next32(),
    s2 = next32(),
    s3 = next32();
  if ((s0 | s1 | s2 | s3) === 0) s0 = 1;
  const uint = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };
  // 53-bit uniform from two words, offset by half a step so that 0 never comes (ln 0 in Box–Muller).
  const uniform = (): number => ((uint() >>> 5) * 67108864 + (uint() >>> 6) + 0.5) / 9007199254740992;
  let spare = NaN;
  const normal = (): number => {
    if (spare === spare) {
      const v = spare;
      spare = NaN;
      return v;
    }
    const r = Math.sqrt(-2 * Math.log(uniform()));
    const phi = 2 * Math.PI * uniform();
    spare = r * Math.sin(phi);
    return r * Math.cos(phi);
  };
  return { uniform, normal };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** Seeded generator for test inputs (mulberry32, a small public-domain PRNG: common practice for tests). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Uniform unit vector (Marsaglia 1972). */
export function randomUnit(r: () => number): [number, number, number] {
  for (;;) {
    const x = 2 * r() - 1, y = 2 * r() - 1;
    const s = x * x + y * y;
    if (s >= 1 || s === 0) continue;
    const f = 2 * Math.sqrt(1 - s);
    return [x * f, y * f, 1 - 2 * s];
  }
}

/** Random symmetric Hamiltonian (cm^-1) as nested rows. */
export function randomHamiltonian(r: () => number, n: number, energySpan = 400, couplingSpan = 100): number[][] {
  const H = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    H[i][i] = energySpan * r();
    for (let j = i + 1; j < n; j++) H[i][j] = H[j][i] = couplingSpan * (2 * r() - 1);
  }
  return H;
}

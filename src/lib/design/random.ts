/**
 * A small seeded PRNG for reproducible tolerance runs: mulberry32 (a 32-bit state generator
 * whose period and equidistribution are adequate for sampling a few parameters; it is not a
 * cryptographic source). Each run derives its own stream from (seed, run index) through a
 * 32-bit mixing hash, so results do not depend on how the runs are split into chunks.
 */
export function mulberry32(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

/** 32-bit integer mix (the finalizer of MurmurHash3): decorrelates neighbouring run indices. */
export function mix32(x: number): number {
	x = Math.imul(x ^ (x >>> 16), 0x85ebca6b);
	x = Math.imul(x ^ (x >>> 13), 0xc2b2ae35);
	return (x ^ (x >>> 16)) >>> 0;
}

export function runStream(seed: number, run: number): () => number {
	return mulberry32(mix32((seed >>> 0) ^ mix32(run + 0x9e3779b9)));
}

/** Standard normal deviate by the Box–Muller transform (one of the pair; the other is dropped). */
export function normal(rand: () => number): number {
	let u = rand();
	while (u <= 0) u = rand();
	return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}

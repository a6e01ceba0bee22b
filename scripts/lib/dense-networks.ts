/**
 * The network families of the dense benchmark (scripts/bench.ts), shared with the large-network
 * benchmark (scripts/bench-large.ts writes the 300-capacitor mesh for the scipy comparison).
 */
export type DenseDoc = {
	schema: 1;
	elements: { id: string; type: string; nodes: string[]; value: number }[];
	input: string;
	output: { node: string };
};
type Doc = DenseDoc;

/** Deterministic generator so every run measures the same networks. */
export function rng(seed: number) {
	let s = seed >>> 0;
	return () => {
		s = (s * 1664525 + 1013904223) >>> 0;
		return s / 2 ** 32;
	};
}

export function denseLadder(n: number): Doc {
	const els: Doc['elements'] = [{ id: 'Vin', type: 'V', nodes: ['x0', 'gnd'], value: 1 }];
	for (let i = 1; i <= n; i++) {
		els.push({ id: `R${i}`, type: 'R', nodes: [`x${i - 1}`, `x${i}`], value: 1e3 });
		els.push({ id: `C${i}`, type: 'C', nodes: [`x${i}`, 'gnd'], value: 1e-9 });
	}
	return { schema: 1, elements: els, input: 'Vin', output: { node: `x${n}` } };
}

/** A grid-like mesh: n/2 nodes, each with a capacitor to ground, resistors to neighbours and a few
 *  random chords, plus capacitors across random resistor pairs; values spread over two decades. */
export function denseMesh(n: number, seed = 7): Doc {
	const r = rng(seed);
	const nodes = Math.max(2, Math.ceil(n / 2));
	const side = Math.ceil(Math.sqrt(nodes));
	const els: Doc['elements'] = [
		{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rs', type: 'R', nodes: ['src', 'm0'], value: 50 }
	];
	const val = (lo: number) => lo * 10 ** (2 * r());
	let nr = 0;
	let nc = 0;
	for (let i = 0; i < nodes; i++) {
		if (i % side !== side - 1 && i + 1 < nodes)
			els.push({ id: `R${nr++}`, type: 'R', nodes: [`m${i}`, `m${i + 1}`], value: val(100) });
		if (i + side < nodes)
			els.push({ id: `R${nr++}`, type: 'R', nodes: [`m${i}`, `m${i + side}`], value: val(100) });
		if (r() < 0.2)
			els.push({ id: `R${nr++}`, type: 'R', nodes: [`m${i}`, 'gnd'], value: val(1e4) });
		els.push({ id: `C${nc++}`, type: 'C', nodes: [`m${i}`, 'gnd'], value: val(1e-12) });
	}
	while (nc < n) {
		const a = Math.floor(r() * nodes);
		let b = Math.floor(r() * nodes);
		if (b === a) b = (a + 1) % nodes;
		els.push({ id: `C${nc++}`, type: 'C', nodes: [`m${a}`, `m${b}`], value: val(1e-12) });
	}
	els.push({ id: 'Rl', type: 'R', nodes: [`m${nodes - 1}`, 'gnd'], value: 1e4 });
	return { schema: 1, elements: els, input: 'Vin', output: { node: `m${nodes - 1}` } };
}


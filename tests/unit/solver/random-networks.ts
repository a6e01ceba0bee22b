import type { El } from './helpers';

/**
 * Random networks for comparing the two back ends (sparse-vs-dense.test.ts and
 * scripts/check-backends.ts, scripts/bench-large.ts): a grid-like mesh of `elements` elements in one of four classes.
 * - rc: resistor mesh, capacitors to ground and across neighbours (extracted-RC-like), leaks;
 * - rc-floating: as rc, plus an island joined to the rest only through capacitors;
 * - rlc: as rc with some resistors replaced by an inductor in series with a resistor;
 * - active: as rc with a few voltage-controlled current sources between distant nodes;
 * values spread over three decades; input a V source through a resistor, or an I source.
 */
export type NetworkClass = 'rc' | 'rc-floating' | 'rlc' | 'active';

export function rng(seed: number) {
	let s = seed >>> 0;
	return () => (s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32;
}

export function randomNetwork(kind: NetworkClass, elements: number, seed: number) {
	const r = rng(seed);
	const val = (lo: number) => lo * 10 ** (3 * r());
	const nodes = Math.max(4, Math.round(elements / 3.2));
	const side = Math.max(2, Math.round(Math.sqrt(nodes)));
	const currentInput = r() < 0.25;
	const els: El[] = currentInput
		? [{ id: 'Iin', type: 'I', nodes: ['gnd', 'm0'], value: 1 }]
		: [
				{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
				{ id: 'Rs', type: 'R', nodes: ['src', 'm0'], value: val(10) }
			];
	let id = 0;
	const add = (type: string, a: string, b: string, value: number) =>
		els.push({ id: `${type}${id++}`, type, nodes: [a, b], value });
	let last = 0;
	for (let i = 0; i < nodes && els.length < elements; i++) {
		const m = `m${i}`;
		last = i;
		for (const j of [i % side < side - 1 ? i + 1 : -1, i + side < nodes ? i + side : -1]) {
			if (j < 0 || j >= nodes || els.length >= elements) continue;
			if (kind === 'rlc' && r() < 0.2) {
				add('L', m, `l${i}_${j}`, val(1e-7));
				add('R', `l${i}_${j}`, `m${j}`, val(1));
			} else add('R', m, `m${j}`, val(100));
			if (r() < 0.3) add('C', m, `m${j}`, val(1e-13));
		}
		add('C', m, 'gnd', val(1e-12));
		if (r() < 0.1 || currentInput) add('R', m, 'gnd', val(1e5));
	}
	if (kind === 'rc-floating') {
		add('R', 'f0', 'f1', val(100));
		add('C', 'f0', 'm1', val(1e-12));
		add('C', 'f1', 'gnd', val(1e-12));
	}
	if (kind === 'active')
		for (let t = 0; t < 4; t++) {
			const a = Math.floor(r() * (last + 1));
			const b = Math.floor(r() * (last + 1));
			els.push({
				id: `G${t}`,
				type: 'VCCS',
				nodes: [`m${a}`, 'gnd', `m${b}`, 'gnd'],
				value: 1e-4 * r()
			});
		}
	return {
		schema: 1 as const,
		elements: els,
		input: currentInput ? 'Iin' : 'Vin',
		output: { node: `m${last}` }
	};
}

/**
 * The large networks of `npm run bench` (scripts/bench-large.ts) and of the scipy comparison
 * (scripts/bench-large-scipy.py reads them as written to bench-results/networks/): uniform RC
 * ladders, extracted-RC-like meshes and a lumped LC line with matched terminations.
 */
import { randomNetwork } from '../../tests/unit/solver/random-networks';

type El = { id: string; type: string; nodes: string[]; value: number };
export type Doc = {
	schema: 1;
	title: string;
	elements: El[];
	input: string;
	output: { node: string };
};

/** n sections of 1 kΩ and 1 nF, driven by an ideal source, far end open: 2n + 1 elements. */
export function ladder(n: number): Doc {
	const els: El[] = [{ id: 'Vin', type: 'V', nodes: ['x0', 'gnd'], value: 1 }];
	for (let i = 1; i <= n; i++) {
		els.push({ id: `R${i}`, type: 'R', nodes: [`x${i - 1}`, `x${i}`], value: 1e3 });
		els.push({ id: `C${i}`, type: 'C', nodes: [`x${i}`, 'gnd'], value: 1e-9 });
	}
	return {
		schema: 1,
		title: `RC ladder, ${n} sections`,
		elements: els,
		input: 'Vin',
		output: { node: `x${n}` }
	};
}

/** A resistor grid with capacitors to ground and to neighbours, some leaks; about `elements` elements. */
export function mesh(elements: number): Doc {
	const doc = randomNetwork('rc', elements - 10, 7) as unknown as Doc;
	return { ...doc, title: `RC mesh, ${doc.elements.length} elements` };
}

/** A 50 Ω lumped line: n sections of 250 nH and 100 pF (Z0 = 50 Ω), 50 Ω source and load. */
export function lcLine(n: number): Doc {
	const els: El[] = [
		{ id: 'Vin', type: 'V', nodes: ['s', 'gnd'], value: 1 },
		{ id: 'Rs', type: 'R', nodes: ['s', 'y0'], value: 50 }
	];
	for (let i = 1; i <= n; i++) {
		els.push({ id: `L${i}`, type: 'L', nodes: [`y${i - 1}`, `y${i}`], value: 250e-9 });
		els.push({ id: `C${i}`, type: 'C', nodes: [`y${i}`, 'gnd'], value: 100e-12 });
	}
	els.push({ id: 'RL', type: 'R', nodes: [`y${n}`, 'gnd'], value: 50 });
	return {
		schema: 1,
		title: `LC line, ${n} sections`,
		elements: els,
		input: 'Vin',
		output: { node: `y${n}` }
	};
}

export function build(family: string, size: number): Doc {
	if (family === 'ladder') return ladder(size);
	if (family === 'mesh') return mesh(size);
	if (family === 'lc-line') return lcLine(size);
	throw new Error(`unknown family ${family}`);
}

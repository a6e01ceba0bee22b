/**
 * Seeded random networks for property tests and benchmarks: a resistive ladder with a mesh of
 * extra resistors, capacitors at every node and across some branches, and (optionally) one
 * inductor and one transconductance, so every kind of stamp is exercised. Values are spread
 * over about two decades around 1 kΩ, 1 nF and 1 mH.
 */
import { mulberry32 } from './random';

export const seededRandom = (seed: number) => mulberry32(seed);

export function randomNetwork(rand: () => number, nodes: number, { extras = true } = {}) {
	const el: { id: string; type: string; nodes: string[]; value: number }[] = [];
	const spread = (x: number) => x * 10 ** (2 * rand() - 1);
	const name = (i: number) => (i === 0 ? 'in' : `n${i}`);
	el.push({ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 });
	for (let i = 1; i <= nodes; i++) {
		el.push({ id: `R${i}`, type: 'R', nodes: [name(i - 1), name(i)], value: spread(1e3) });
		el.push({ id: `C${i}`, type: 'C', nodes: [name(i), 'gnd'], value: spread(1e-9) });
		if (i > 2 && rand() < 0.5) {
			const j = Math.floor(rand() * (i - 1));
			el.push({ id: `Rx${i}`, type: 'R', nodes: [name(j), name(i)], value: spread(1e4) });
		}
		if (i > 1 && rand() < 0.3)
			el.push({ id: `Cx${i}`, type: 'C', nodes: [name(i - 1), name(i)], value: spread(1e-10) });
	}
	el.push({ id: 'Rload', type: 'R', nodes: [name(nodes), 'gnd'], value: spread(1e4) });
	if (extras) {
		el.push({ id: 'L1', type: 'L', nodes: [name(1), 'gnd'], value: spread(1e-3) });
		el.push({
			id: 'G1',
			type: 'VCCS',
			nodes: [name(nodes), 'gnd', name(1), 'gnd'],
			value: spread(1e-5)
		});
	}
	return { schema: 1, elements: el, input: 'Vin', output: { node: name(nodes) } };
}

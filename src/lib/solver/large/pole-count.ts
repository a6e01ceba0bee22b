import { GROUND, type ResolvedNetwork } from '../types';

/**
 * The number of finite natural frequencies by structure: every capacitor except one per
 * independent loop of capacitors and voltage sources, plus every inductor except one per
 * independent cut set of inductors and current sources (Bryant's order of complexity of an RLC
 * network; P. R. Bryant, "The order of complexity of electrical networks", Proc. IEE 106C, 1959).
 * It holds for generic values; exact cancellations can lower it. Null with controlled sources or
 * op-amps, whose couplings can change the order in ways the graph alone does not show.
 */
export function structuralPoleCount(net: ResolvedNetwork): number | null {
	const els = net.elements;
	if (els.some((e) => !['R', 'C', 'L', 'V', 'I'].includes(e.type))) return null;
	const nn = net.nodeNames.length;
	const node = (x: number) => (x === GROUND ? nn : x);
	const forest = () => {
		const parent = Int32Array.from({ length: nn + 1 }, (_, i) => i);
		const find = (x: number): number => {
			while (parent[x] !== x) x = parent[x] = parent[parent[x]];
			return x;
		};
		return (a: number, b: number) => {
			const [ra, rb] = [find(node(a)), find(node(b))];
			if (ra === rb) return false;
			parent[ra] = rb;
			return true;
		};
	};
	// Capacitors in a forest of (V sources first, then capacitors): the rest close C–V loops.
	const cv = forest();
	for (const e of els) if (e.type === 'V') cv(e.nodes[0], e.nodes[1]);
	let count = 0;
	for (const e of els) if (e.type === 'C' && cv(e.nodes[0], e.nodes[1])) count++;
	// Inductors: contract every other branch that carries current (R, C, V); an inductor that
	// still joins two parts lies on a cut set of inductors and current sources only.
	const rest = forest();
	for (const e of els)
		if (e.type === 'R' || e.type === 'C' || e.type === 'V') rest(e.nodes[0], e.nodes[1]);
	for (const e of els) if (e.type === 'L' && !rest(e.nodes[0], e.nodes[1])) count++;
	return count;
}

import { SolverError } from './errors';
import { UnionFind } from './union-find';
import { GROUND, type ResolvedElement, type ResolvedNetwork } from './types';

/** Edges that fix a voltage: their loops leave a branch current undetermined. */
const VOLTAGE_EDGE = new Set(['V', 'VCVS', 'CCVS', 'OPAMP']);
/** Edges that fix a current: a node set reached only through them has no KCL solution. */
const CURRENT_EDGE = new Set(['I', 'VCCS', 'CCCS']);

/** [a, b] of the branch an element puts between two nodes; the op-amp's is out→gnd. */
export function branchNodes(e: ResolvedElement): [number, number] {
	return e.type === 'OPAMP' ? [e.nodes[2], GROUND] : [e.nodes[0], e.nodes[1]];
}

/**
 * Structural checks that make the network's equations singular for every s, so they are
 * reported as input errors rather than discovered as a failed factorization.
 */
export function checkTopology(net: ResolvedNetwork): void {
	const n = net.nodeNames.length;
	const els = net.elements;
	const name = (node: number) => (node === GROUND ? 'gnd' : net.nodeNames[node]);

	// A loop of voltage-defined branches, possibly through inductors (which are shorts at DC and
	// make the source current of such a loop grow without bound). Each source is tested against
	// all other voltage-like branches so the message names a source that is really in a loop.
	const loopish = els.filter((e) => VOLTAGE_EDGE.has(e.type) || e.type === 'L');
	for (const src of loopish) {
		if (!VOLTAGE_EDGE.has(src.type)) continue;
		const uf = new UnionFind(n);
		for (const e of loopish) if (e !== src) uf.union(...branchNodes(e));
		const [a, b] = branchNodes(src);
		if (uf.connected(a, b)) {
			throw new SolverError(
				'source_loop',
				`element "${src.id}" closes a loop of voltage sources, op-amp outputs or inductors`,
				{ element: src.id }
			);
		}
	}

	// Components of everything except current-defined branches. A component without ground is
	// reached only through current sources (a cut set) or not at all (floating).
	const uf = new UnionFind(n);
	for (const e of els) if (!CURRENT_EDGE.has(e.type)) uf.union(...branchNodes(e));
	const g = uf.groundRoot();
	for (const e of els) {
		if (!CURRENT_EDGE.has(e.type)) continue;
		for (const node of [e.nodes[0], e.nodes[1]]) {
			if (uf.find(node) !== g) {
				throw new SolverError(
					'current_cutset',
					`element "${e.id}": node "${name(node)}" is reached only through current sources`,
					{ element: e.id, node: name(node) }
				);
			}
		}
	}
	for (let i = 0; i < n; i++) {
		if (uf.find(i) !== g) {
			throw new SolverError(
				'singular',
				`node "${name(i)}" has no connection to gnd (only op-amp or controlled-source inputs)`,
				{ node: name(i) }
			);
		}
	}

	const touches = new Array<number>(n).fill(0);
	const lastToucher = new Array<string>(n).fill('');
	for (const e of els) {
		for (const node of e.nodes) {
			if (node === GROUND) continue;
			touches[node]++;
			lastToucher[node] = e.id;
		}
	}
	for (let i = 0; i < n; i++) {
		if (touches[i] === 1) {
			net.warnings.push({
				code: 'dangling_node',
				message: `node "${name(i)}" is touched only by ${lastToucher[i]}`,
				node: name(i),
				element: lastToucher[i]
			});
		}
	}
}

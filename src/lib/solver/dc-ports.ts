import { assemble, type ReactiveMode } from './assemble';
import { portModelFrom, SINGULAR_PIVOT, type PortModel } from './port-model';
import { edgesOnLoops } from './loop-edges';
import { dcRoles, roleBranch } from './dc-roles';
import { UnionFind } from './union-find';
import type { ResolvedNetwork } from './types';

/**
 * The resistive network at DC with each reactive element open, shorted or driven as a port:
 * the engine of every time constant. Infinite readings are found from the structure, not from
 * a near-singular solve: a current port whose terminals lie in different DC components sees
 * an infinite resistance; a voltage port inside a loop of shorts draws an infinite current.
 * Those ports are flagged `infinite`, and the matrix is solved without them (floating
 * components anchored to ground, redundant shorts dropped) so the other readings stay exact.
 */
export interface DcPorts extends PortModel {
	/** Per port: its own reading is infinite; its row and column are then meaningless. */
	infinite: Uint8Array;
	/** True when the reduced matrix was still singular (an active network without a DC solution). */
	singular: boolean;
	/**
	 * Per port: its configuration is inconsistent — the other elements' shorts short an ideal
	 * voltage output (a controlled source or an op-amp output) — so its reading is unknown.
	 */
	unknown: Uint8Array;
	/** The ideal outputs this configuration shorts, and the reactive elements that short them. */
	conflicts: { element: string; by: string[] }[];
}

/**
 * Ideal voltage outputs (dc-roles.ts) whose terminals the configuration's shorts join. For each,
 * the reactive shorts without which it would not be shorted (`essential`): such a port drives a
 * voltage straight across the ideal output and reads zero resistance; every other port sees an
 * inconsistent configuration. Only runs the per-port search for outputs that are shorted.
 */
function shortedIdealOutputs(
	net: ResolvedNetwork,
	ideal: number[],
	zeroShorts: number[],
	shortLike: (k: number) => boolean
): { element: number; essential: number[] }[] {
	const els = net.elements;
	const reactiveShorts = net.reactive.filter(shortLike);
	if (!ideal.length || !reactiveShorts.length) return [];
	const out: { element: number; essential: number[] }[] = [];
	for (const e of ideal) {
		const joined = (skip: number) => {
			const uf = new UnionFind(net.nodeNames.length);
			for (const k of zeroShorts) uf.union(...roleBranch(els[k])!);
			for (const o of ideal) if (o !== e) uf.union(...roleBranch(els[o])!);
			for (const k of reactiveShorts) if (k !== skip) uf.union(els[k].nodes[0], els[k].nodes[1]);
			const [a, b] = roleBranch(els[e])!;
			return uf.connected(a, b);
		};
		if (!joined(-1)) continue;
		out.push({ element: e, essential: reactiveShorts.filter((k) => !joined(k)) });
	}
	return out;
}

export function dcPorts(net: ResolvedNetwork, modeOf: (k: number) => ReactiveMode): DcPorts {
	const n = net.nodeNames.length;
	const els = net.elements;
	const roles = dcRoles(net);
	const edgeOfRole = (k: number) => roleBranch(els[k])!;
	const zeroShorts = els.map((_, k) => k).filter((k) => roles[k] === 'short');
	const ideal = els.map((_, k) => k).filter((k) => roles[k] === 'ideal');
	// Shorts: zero-voltage branches (zeroed sources), then ideal outputs (a loop of those is
	// refused by validation), then the shorted/voltage-port reactive ones; a reactive short
	// that closes a loop is dropped from the equations (its current is undetermined).
	const shorts = new UnionFind(n);
	for (const k of [...zeroShorts, ...ideal]) shorts.union(...edgeOfRole(k));
	const dropped = new Set<number>();
	const shortLike = (k: number) => modeOf(k) === 'short' || modeOf(k) === 'vport';
	for (const k of net.reactive) {
		if (shortLike(k) && !shorts.union(els[k].nodes[0], els[k].nodes[1])) dropped.add(k);
	}
	// A voltage port is inside a loop of shorts when the other shorts already join its
	// terminals: exactly when it is not a bridge of the graph of all shorts.
	const shortEdges: [number, number][] = [];
	for (const k of [...zeroShorts, ...ideal]) shortEdges.push(edgeOfRole(k));
	const edgeOf = new Map<number, number>();
	for (const k of net.reactive) {
		if (!shortLike(k)) continue;
		edgeOf.set(k, shortEdges.length);
		shortEdges.push([els[k].nodes[0], els[k].nodes[1]]);
	}
	const onLoop = edgesOnLoops(n, shortEdges);
	const inLoop = new Set<number>();
	for (const k of net.reactive) if (modeOf(k) === 'vport' && onLoop[edgeOf.get(k)!]) inLoop.add(k);
	const mode = (k: number): ReactiveMode => (dropped.has(k) ? 'open' : modeOf(k));
	const conflicts = shortedIdealOutputs(net, ideal, zeroShorts, shortLike);

	// DC components through every branch that carries a determined current path.
	const comp = new UnionFind(n);
	els.forEach((e, k) => {
		if (roles[k] !== 'none') comp.union(...edgeOfRole(k));
		if ((e.type === 'C' || e.type === 'L') && (mode(k) === 'short' || mode(k) === 'vport')) {
			comp.union(e.nodes[0], e.nodes[1]);
		}
	});
	const a = assemble(net, mode);
	// Anchor each floating component at one node: with no other way out, no current flows in the
	// anchor, so it changes no reading that stays inside the component.
	let gScale = 0;
	for (let i = 0; i < a.size; i++) gScale = Math.max(gScale, Math.abs(a.g[i * a.size + i]));
	const anchored = new Set<number>([comp.groundRoot()]);
	for (let i = 0; i < n; i++) {
		const r = comp.find(i);
		if (anchored.has(r)) continue;
		anchored.add(r);
		a.g[i * a.size + i] += gScale || 1;
	}

	// A voltage port that is a bridge of everything that can carry current at DC (every branch
	// but open reactive elements and zeroed current sources; a controlled source's output counts,
	// to be safe) has no return path: driven, it carries exactly no current, so its own reading
	// is 0 — resistance infinite, τ = 0 — not the round-off a solve leaves (an inductor read
	// −1.4e17 Ω and τ = −3.6e-23 s on the dense path, 0 on the sparse one).
	const paths: [number, number][] = [];
	const pathOf = new Map<number, number>();
	els.forEach((e, k) => {
		if (e.type === 'I') return;
		if (e.type === 'C' || e.type === 'L') {
			const m = mode(k);
			if (m !== 'short' && m !== 'vport') return;
			if (m === 'vport') pathOf.set(k, paths.length);
		}
		paths.push(e.type === 'OPAMP' ? [e.nodes[2], -1] : [e.nodes[0], e.nodes[1]]);
	});
	const pathOnLoop = edgesOnLoops(n, paths);
	const noReturn = (k: number) => pathOf.has(k) && !pathOnLoop[pathOf.get(k)!];

	const full = net.reactive.filter((k) => modeOf(k) === 'iport' || modeOf(k) === 'vport');
	const present = a.ports.map((p) => p.element);
	const model = portModelFrom(a, 0);
	const m = full.length;
	const out: DcPorts = {
		...model,
		m,
		H: new Float64Array(m * m),
		h: new Float64Array(m),
		g: new Float64Array(m),
		gz: new Float64Array(m),
		d: Float64Array.from(full.map((k) => (els[k].type === 'C' ? els[k].value : -els[k].value))),
		elements: full,
		infinite: new Uint8Array(m),
		singular: model.pivotRatio < SINGULAR_PIVOT,
		unknown: new Uint8Array(m),
		conflicts: conflicts.map((c) => ({
			element: els[c.element].id,
			by: c.essential.map((k) => els[k].id)
		}))
	};
	for (let i = 0; i < m; i++)
		if (conflicts.some((c) => !c.essential.includes(full[i]))) out.unknown[i] = 1;
	// Scatter the solved ports back into the full port list.
	const at = new Map(present.map((k, i) => [k, i]));
	const where = full.map((k) => at.get(k) ?? -1);
	for (let i = 0; i < m; i++) {
		const k = full[i];
		const [na, nb] = [els[k].nodes[0], els[k].nodes[1]];
		const crosses = modeOf(k) === 'iport' && comp.find(na) !== comp.find(nb);
		if (crosses || inLoop.has(k) || dropped.has(k) || where[i] < 0 || out.singular)
			out.infinite[i] = 1;
		const pi = where[i];
		if (pi < 0) continue;
		out.h[i] = model.h[pi];
		out.g[i] = model.g[pi];
		out.gz[i] = model.gz[pi];
		for (let j = 0; j < m; j++) {
			const pj = where[j];
			if (pj >= 0) out.H[i * m + j] = model.H[pi * model.m + pj];
		}
		if (noReturn(k)) out.H[i * m + i] = 0;
	}
	return out;
}

// Comparing networks without trusting net names: the editor may name nets afresh on every save
// (n1, n2…), so "the same wiring" means each terminal touches the same other terminals, counting
// only parts both revisions have (a new part is reported as added, not as rewiring everything).
// Values compare as numbers, so "1n", "1 n" and 1e-9 are the same capacitor.
import { canonicalJson } from '../../exchange/canonical-json';
import type { NetworkDocument, NetworkElement } from '../../network/schema';
import { parseValue } from '../../solver';

const isGround = (n: string | number) => String(n) === '0' || String(n) === 'gnd';

/** Per element, a signature of what each of its terminals is connected to. */
export function wiring(doc: NetworkDocument, keep?: Set<string>): Map<string, string> {
	const kept = doc.elements.filter((e) => !keep || keep.has(e.id));
	const byNet = new Map<string, string[]>();
	for (const e of kept) e.nodes.forEach((n, i) => isGround(n) || (byNet.get(String(n)) ?? byNet.set(String(n), []).get(String(n))!).push(`${e.id}.${i}`));
	const out = new Map<string, string>();
	for (const e of kept) {
		out.set(e.id, e.nodes.map((n, i) => (isGround(n) ? 'gnd' : byNet.get(String(n))!.filter((t) => t !== `${e.id}.${i}`).sort().join(','))).join('|'));
	}
	return out;
}

/** The output node as the terminals on it (name-free), counting only parts in `keep` if given. */
export function outputSignature(doc: NetworkDocument, keep?: Set<string>): string {
	const kept = doc.elements.filter((e) => !keep || keep.has(e.id));
	// A node only new (or only removed) parts touch has no name-free signature: use its name.
	const sig = (node: string | number) =>
		isGround(node) ? 'gnd' : kept.flatMap((e) => e.nodes.map((n, i) => (String(n) === String(node) ? `${e.id}.${i}` : null))).filter(Boolean).sort().join(',') || `net ${node}`;
	return `${sig(doc.output.node)}/${sig(doc.output.reference ?? 'gnd')}`;
}

export function sameValue(a: NetworkElement['value'], b: NetworkElement['value']): boolean {
	if (a === undefined || b === undefined) return a === b;
	try {
		const [x, y] = [parseValue(a), parseValue(b)];
		return x === y || Math.abs(x - y) <= 1e-12 * Math.max(Math.abs(x), Math.abs(y));
	} catch {
		return String(a) === String(b);
	}
}

/** Is element `id` the same part, with the same wiring, in both documents? null when absent from `b`. */
export function elementUnchanged(id: string, a: NetworkDocument, b: NetworkDocument): boolean | null {
	const [x, y] = [a.elements.find((e) => e.id === id), b.elements.find((e) => e.id === id)];
	if (!y) return null;
	if (!x) return false;
	const both = new Set(a.elements.filter((e) => b.elements.some((f) => f.id === e.id)).map((e) => e.id));
	return x.type === y.type && sameValue(x.value, y.value) && (x.control ?? null) === (y.control ?? null) && wiring(a, both).get(id) === wiring(b, both).get(id);
}

/** True when the two documents are the same network (whatever their nets are called). */
export function sameNetwork(a: NetworkDocument, b: NetworkDocument): boolean {
	if (a.elements.length !== b.elements.length || a.input !== b.input) return false;
	if (!a.elements.every((e) => elementUnchanged(e.id, a, b) === true)) return false;
	// The variants belong to the design a sign-off covers: a changed override is a changed network.
	if (canonicalJson(a.variants ?? null) !== canonicalJson(b.variants ?? null)) return false;
	return outputSignature(a) === outputSignature(b);
}

function terminalsOn(doc: NetworkDocument, net: string, keep: Set<string>): string[] {
	return doc.elements
		.filter((e) => keep.has(e.id))
		.flatMap((e) => e.nodes.map((n, i) => ((isGround(n) && isGround(net)) || String(n) === net ? `${e.id}.${i}` : null)))
		.filter((t): t is string => t !== null)
		.sort();
}

/** Follow a net by the terminals on it: `current` when the same terminals still share a net, `changed` when some do. */
export function netStatus(net: string, written: NetworkDocument, latest: NetworkDocument): 'current' | 'changed' | 'removed' {
	const both = new Set(written.elements.filter((e) => latest.elements.some((f) => f.id === e.id)).map((e) => e.id));
	const before = terminalsOn(written, net, both);
	if (before.length === 0) return 'removed';
	if (isGround(net)) return 'current';
	const [id, i] = before[0].split('.');
	const there = latest.elements.find((e) => e.id === id)!.nodes[Number(i)];
	const after = terminalsOn(latest, String(there), both);
	return after.join(',') === before.join(',') ? 'current' : after.some((t) => before.includes(t)) ? 'changed' : 'removed';
}

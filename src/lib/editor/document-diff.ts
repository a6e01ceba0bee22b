// What another person changed, in words: compares the revision an edit started from with the
// revision that won the race, element by element.
import type { NetworkDocument } from '$lib/network/schema';

function connections(d: NetworkDocument, keep: Set<string>): Map<string, string> {
	// Connectivity without node names: each terminal lists the terminals on its node, counting
	// only elements both revisions have (an added part is reported as added, not as rewiring).
	const byNode = new Map<string, string[]>();
	for (const e of d.elements.filter((x) => keep.has(x.id)))
		e.nodes.forEach((n, i) => {
			const k = String(n) === '0' ? 'gnd' : String(n);
			(byNode.get(k) ?? byNode.set(k, []).get(k)!).push(`${e.id}.${i}`);
		});
	const out = new Map<string, string>();
	for (const e of d.elements.filter((x) => keep.has(x.id))) {
		out.set(
			e.id,
			e.nodes
				.map((n) => {
					const k = String(n) === '0' ? 'gnd' : String(n);
					return k === 'gnd' ? 'gnd' : byNode.get(k)!.slice().sort().join(',');
				})
				.join('|')
		);
	}
	return out;
}

export function describeChanges(base: NetworkDocument, theirs: NetworkDocument): string[] {
	const out: string[] = [];
	const a = new Map(base.elements.map((e) => [e.id, e]));
	const b = new Map(theirs.elements.map((e) => [e.id, e]));
	const both = new Set([...a.keys()].filter((id) => b.has(id)));
	const ca = connections(base, both);
	const cb = connections(theirs, both);
	for (const [id, e] of b) {
		const old = a.get(id);
		if (!old) {
			out.push(`added ${id} (${e.type}${e.value !== undefined ? `, ${e.value}` : ''})`);
			continue;
		}
		if (old.type !== e.type) out.push(`${id}: type ${old.type} → ${e.type}`);
		if (String(old.value ?? '') !== String(e.value ?? ''))
			out.push(`${id}: value ${old.value ?? '—'} → ${e.value ?? '—'}`);
		if ((old.control ?? '') !== (e.control ?? ''))
			out.push(`${id}: driven by ${old.control ?? '—'} → ${e.control ?? '—'}`);
		if (ca.get(id) !== cb.get(id)) out.push(`${id}: wiring changed`);
	}
	for (const id of a.keys()) if (!b.has(id)) out.push(`removed ${id}`);
	if (base.input !== theirs.input) out.push(`input source ${base.input} → ${theirs.input}`);
	const oa = `${base.output.node}/${base.output.reference ?? 'gnd'}`;
	const ob = `${theirs.output.node}/${theirs.output.reference ?? 'gnd'}`;
	if (out.length === 0 && oa !== ob) out.push(`output ${oa} → ${ob}`);
	if ((base.title ?? '') !== (theirs.title ?? ''))
		out.push(`title “${base.title ?? ''}” → “${theirs.title ?? ''}”`);
	return out.length ? out : ['moved parts on the canvas (the network itself is the same)'];
}

// Network document (+ the stored canvas layout) → drawing. The document is the authority: the
// stored layout is used only when it still draws exactly that network; otherwise (imported
// sheets, sheets saved by the API or the seed) the network is laid out automatically.
import type { NetworkDocument } from '$lib/network/schema';
import { autoLayout } from './auto-layout';
import { buildDocument } from './to-document';
import type { SheetLayout, Snapshot } from './types';
import { isCircuit, KINDS } from './kinds';

export function isSheetLayout(raw: unknown): raw is SheetLayout {
	const l = raw as SheetLayout | null;
	return (
		!!l &&
		l.format === 'polewise-canvas' &&
		l.version === 1 &&
		Array.isArray(l.items) &&
		Array.isArray(l.wires)
	);
}

/** Same elements, types, values, controls, input and the same connectivity (names of nets aside). */
export function sameNetwork(a: NetworkDocument, b: NetworkDocument): boolean {
	if (a.elements.length !== b.elements.length || a.input !== b.input) return false;
	const canon = (d: NetworkDocument) => {
		const rename = new Map<string, string>([
			['gnd', 'gnd'],
			['0', 'gnd']
		]);
		const nodeName = (n: string | number) => {
			const k = String(n);
			if (!rename.has(k)) rename.set(k, `#${rename.size}`);
			return rename.get(k)!;
		};
		const els = [...d.elements].sort((x, y) => (x.id < y.id ? -1 : 1));
		const lines = els.map(
			(e) =>
				`${e.id}|${e.type}|${String(e.value ?? '')}|${e.control ?? ''}|${e.role ?? 'design'}|${e.range ? `${e.range.min}…${e.range.max}` : ''}|${e.nodes.map(nodeName).join(',')}`
		);
		lines.push(`out|${nodeName(d.output.node)}|${nodeName(d.output.reference ?? 'gnd')}`);
		return lines.join('\n');
	};
	return canon(a) === canon(b);
}

export function fromDocument(doc: NetworkDocument, layout?: unknown): Snapshot {
	// Variants are kept by part name, so they belong to the document whichever way it is drawn.
	const variants = doc.variants ?? null;
	if (isSheetLayout(layout)) {
		const restored: Snapshot = {
			title: doc.title ?? '',
			items: layout.items,
			wires: layout.wires,
			input: layout.input,
			variants
		};
		if (sameNetwork(buildDocument(restored).document, doc)) return withDocumentNames(restored, doc);
	}
	return withDocumentNames({ ...autoLayout(doc), variants }, doc);
}

/**
 * The document's node names pinned on the drawing's terminals: its nets are called what the
 * document calls them (tip, adc), in the editor, its pickers and everything saved after —
 * one naming everywhere. Each part's terminal i lies on the document's node i; the output
 * marker's terminals on the output node and reference.
 */
export function withDocumentNames(s: Snapshot, doc: NetworkDocument): Snapshot {
	const byName = new Map(doc.elements.map((e) => [e.id, e]));
	const netNames: Record<string, string> = {};
	const pin = (key: string, node: string | number | undefined) => {
		const n = node === undefined ? '' : String(node);
		if (n && n !== 'gnd' && n !== '0') netNames[key] = n;
	};
	for (const it of s.items) {
		const e = isCircuit(it.kind) ? byName.get(it.name) : undefined;
		if (e) KINDS[it.kind].terminals.forEach((t, i) => pin(`${it.id}:${t.name}`, e.nodes[i]));
		if (it.kind === 'PROBE') {
			pin(`${it.id}:pos`, doc.output.node);
			pin(`${it.id}:neg`, doc.output.reference);
		}
	}
	return { ...s, netNames };
}

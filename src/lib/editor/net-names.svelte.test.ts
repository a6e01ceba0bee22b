// One naming of nets (issue 16, item 3): a document's node names are the drawing's net names,
// they stay put while the drawing changes around them, and people can rename them — the saved
// document (which every picker, export, comment anchor and report reads) carries the same names.
import { describe, expect, it } from 'vitest';
import { EditorState } from './editor-state.svelte';
import { fromDocument } from './from-document';
import { buildDocument } from './to-document';
import type { NetworkDocument } from '$lib/network/schema';
import { digitizerDivider } from '$lib/server/db/seed/demo-sheets';

// The demo's 10:1 divider: nodes src, tip and adc.
const divider = digitizerDivider as NetworkDocument;
const nodesOf = (doc: NetworkDocument) =>
	Object.fromEntries(doc.elements.map((e) => [e.id, e.nodes.map(String)]));

function opened(doc = divider, layout?: unknown) {
	const s = new EditorState();
	s.load(fromDocument(doc, layout));
	return s;
}

describe('net names', () => {
	it('a document opens with its own node names, and saves them back', () => {
		const s = opened();
		expect(nodesOf(s.built.document)).toEqual(nodesOf(divider));
		expect(s.built.document.output).toEqual({ node: 'adc', reference: 'gnd' });
		expect(s.built.nets.nets.map((n) => n.name).sort()).toEqual(['adc', 'gnd', 'src', 'tip']);
	});

	it('a stored layout without names still opens with the document’s names', () => {
		const first = opened();
		const { layout } = buildDocument({ ...first.snapshot, netNames: {} });
		const s = opened(divider, layout);
		expect(nodesOf(s.built.document)).toEqual(nodesOf(divider));
	});

	it('nets keep their names when parts around them come and go', () => {
		const s = opened();
		const rsrc = s.items.find((i) => i.name === 'Rsrc')!;
		s.select([rsrc.id]);
		s.deleteSelected();
		// Rsrc was the only part joining src and tip: both nets still have their names.
		const doc = s.built.document;
		expect(doc.elements.find((e) => e.id === 'Vsig')!.nodes[0]).toBe('src');
		expect(doc.elements.find((e) => e.id === 'Rtop')!.nodes).toEqual(['tip', 'adc']);
		// A new, unwired part gets fresh names that do not take an existing one.
		s.addItem('C', 0, 0);
		const names = s.built.nets.nets.map((n) => n.name);
		expect(new Set(names).size).toBe(names.length);
	});

	it('a net split in two: the larger part keeps the name, the other gets a fresh one', () => {
		const s = opened();
		// Cut every wire at Radc's top terminal: adc loses Radc.
		const radc = s.items.find((i) => i.name === 'Radc')!;
		const cut = s.wires
			.filter((w) => w.from.item === radc.id || w.to.item === radc.id)
			.filter((w) => [w.from, w.to].some((r) => r.item === radc.id && r.terminal === 'a'));
		s.select(
			[],
			cut.map((w) => w.id)
		);
		s.deleteSelected();
		const doc = s.built.document;
		expect(doc.elements.find((e) => e.id === 'Rtop')!.nodes[1]).toBe('adc');
		expect(doc.elements.find((e) => e.id === 'Radc')!.nodes[0]).not.toBe('adc');
	});

	it('renaming a net renames it everywhere in the document, as one undo step', () => {
		const s = opened();
		expect(s.renameNet('adc', 'digitizer_in')).toBeNull();
		const doc = s.built.document;
		expect(doc.elements.find((e) => e.id === 'Radc')!.nodes[0]).toBe('digitizer_in');
		expect(doc.elements.find((e) => e.id === 'Ctop')!.nodes[1]).toBe('digitizer_in');
		expect(doc.output.node).toBe('digitizer_in');
		s.undo();
		expect(s.built.document.output.node).toBe('adc');
	});

	it('a net name is refused when taken, the reference, or malformed — naming why', () => {
		const s = opened();
		expect(s.renameNet('adc', 'tip')).toBe('another net is already called "tip"');
		expect(s.renameNet('adc', 'gnd')).toMatch(/reference node/);
		expect(s.renameNet('adc', '2nd stage')).toMatch(/starts with a letter/);
		expect(s.built.document.output.node).toBe('adc');
	});
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { Autosave } from '$lib/editor/autosave.svelte';
import { DrawingLink } from '$lib/editor/drawing-link.svelte';
import { EditorState } from '$lib/editor/editor-state.svelte';
import { fromDocument } from '$lib/editor/from-document';
import type { NetworkDocument } from '$lib/network/schema';
import { DesignClient, sourceLabel } from './design-client.svelte';

const saved: NetworkDocument = {
	schema: 1,
	elements: [
		{ id: 'V1', type: 'V', nodes: ['a', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['a', 'b'], value: '1k' },
		{ id: 'C1', type: 'C', nodes: ['b', 'gnd'], value: '1n' }
	],
	input: 'V1',
	output: { node: 'b', reference: 'gnd' }
};

/** A sheet page's pieces: the editor opened on revision 3, its autosave, the link. */
function page() {
	const editor = new EditorState();
	editor.load(fromDocument(saved, null));
	const save = new Autosave('s1', 10_000, (async () => new Response('{}')) as typeof fetch);
	save.settle(3, { document: editor.built.document, layout: editor.built.layout });
	const link = new DrawingLink();
	link.attach(editor, save);
	return { editor, save, link };
}

const value = (doc: NetworkDocument, id: string) => doc.elements.find((e) => e.id === id)!.value;

afterEach(() => vi.unstubAllGlobals());

describe('DesignClient', () => {
	it('an editor’s aids run on the drawing with its unsaved edits, and say so', async () => {
		const { editor, save, link } = page();
		const client = new DesignClient('s1', true, link);
		const fetcher = vi.fn();
		vi.stubGlobal('fetch', fetcher);
		editor.setValues({ R1: '2.2k' });
		save.changed({ document: editor.built.document, layout: editor.built.layout });
		const { document, source } = await client.network();
		expect(value(document, 'R1')).toBe('2.2k');
		expect(source).toEqual({ kind: 'drawing', base: 3, unsaved: true });
		expect(sourceLabel(source)).toBe('the drawing as it is now (unsaved edits on revision 3)');
		// The drawing is at hand: nothing is fetched from the server.
		expect(fetcher).not.toHaveBeenCalled();
		expect(client.setValues({ C1: 4.7e-9 })).toEqual(['C1']);
		expect(value(client.document!, 'C1')).toBe('4.7n');
		save.dispose();
	});

	it('refuses a drawing that cannot be analysed yet, naming why', async () => {
		const { editor, link } = page();
		const client = new DesignClient('s1', true, link);
		editor.setValues({ R1: '2.2kk' });
		await expect(client.network()).rejects.toMatchObject({
			message: expect.stringMatching(/^The drawing cannot be analysed yet: R1:/)
		});
	});

	it('a read-only viewer’s aids run on the latest saved revision and cannot change values', async () => {
		const { editor, link } = page();
		editor.readonly = true;
		const client = new DesignClient('s1', false, link);
		const fetcher = vi.fn(
			async () =>
				new Response(JSON.stringify({ revision: { number: 7, document: saved } }), {
					status: 200
				})
		);
		vi.stubGlobal('fetch', fetcher);
		expect(client.source).toBeNull();
		const { source } = await client.network();
		expect(fetcher).toHaveBeenCalledWith('/api/sheets/s1', expect.anything());
		expect(source).toEqual({ kind: 'revision', number: 7 });
		expect(sourceLabel(client.source!)).toBe('saved revision 7');
		expect(client.setValues({ R1: 1 })).toEqual([]);
	});
});

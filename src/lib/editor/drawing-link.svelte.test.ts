import { describe, expect, it } from 'vitest';
import { Autosave } from './autosave.svelte';
import { DrawingLink } from './drawing-link.svelte';
import { EditorState } from './editor-state.svelte';

function sheet() {
	const editor = new EditorState();
	const v = editor.addItem('V', 0, 0)!;
	const r = editor.addItem('R', 100, 0)!;
	const c = editor.addItem('C', 200, 0)!;
	const g = editor.addItem('GND', 0, 100)!;
	editor.connect({ item: v, terminal: 'n' }, { item: g, terminal: 'g' });
	editor.connect({ item: v, terminal: 'p' }, { item: r, terminal: 'a' });
	const puts: {
		baseRevision: number;
		document: { elements: { id: string; value?: unknown }[] };
	}[] = [];
	const fetcher = (async (_u: string, init: RequestInit) => {
		const body = JSON.parse(String(init.body));
		puts.push(body);
		return new Response(JSON.stringify({ revision: { number: body.baseRevision + 1 } }), {
			status: 201
		});
	}) as unknown as typeof fetch;
	const save = new Autosave('sheet', 5, fetcher);
	const content = () => ({ document: editor.built.document, layout: editor.built.layout });
	save.settle(4, content());
	return { editor, save, content, puts, r, c };
}

describe('DrawingLink', () => {
	it('shows nothing until an editor is attached, then the drawing as it is now', () => {
		const { editor, save } = sheet();
		const link = new DrawingLink();
		expect(link.now).toBeNull();
		const detach = link.attach(editor, save);
		expect(link.now).toMatchObject({ base: 4, unsaved: false });
		expect(link.now!.document).toEqual(editor.built.document);
		// The drawing has no output marker yet: the reason is passed on, not hidden.
		expect(link.now!.problem).toMatch(/output marker/);
		detach();
		expect(link.now).toBeNull();
	});

	it('setValues writes typed values as one undo step that autosave saves like any edit', async () => {
		const { editor, save, content, puts, r, c } = sheet();
		const link = new DrawingLink();
		link.attach(editor, save);
		const version = editor.version;
		expect(link.setValues({ R1: 8.2e6, C1: 3.9e-11, R9: 1 })).toEqual(['R1', 'C1']);
		expect(editor.version).toBe(version + 1);
		expect(editor.items.find((i) => i.id === r)!.value).toBe('8.2M');
		expect(editor.items.find((i) => i.id === c)!.value).toBe('39p');
		save.changed(content()); // what the workbench does on every version bump
		expect(link.now!.unsaved).toBe(true);
		await save.flush();
		expect(puts).toHaveLength(1);
		expect(puts[0].baseRevision).toBe(4);
		expect(puts[0].document.elements.find((e) => e.id === 'R1')!.value).toBe('8.2M');
		expect(link.now).toMatchObject({ base: 5, unsaved: false });
		editor.undo();
		expect(editor.items.find((i) => i.id === r)!.value).toBe('1k');
		expect(editor.items.find((i) => i.id === c)!.value).toBe('10p');
	});

	it('a read-only editor is not offered: viewers keep the saved revision', () => {
		const { editor, save } = sheet();
		const link = new DrawingLink();
		link.attach(editor, save);
		editor.readonly = true;
		expect(link.now).toBeNull();
		expect(link.setValues({ R1: 2e3 })).toEqual([]);
	});
});

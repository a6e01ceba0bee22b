import { describe, expect, it } from 'vitest';
import { EditorState } from './editor-state.svelte';

function divider() {
	const s = new EditorState();
	const v = s.addItem('V', 0, 0)!;
	const r = s.addItem('R', 100, 0)!;
	const g = s.addItem('GND', 0, 100)!;
	s.connect({ item: v, terminal: 'n' }, { item: g, terminal: 'g' });
	s.connect({ item: v, terminal: 'p' }, { item: r, terminal: 'a' });
	return { s, v, r, g };
}

describe('EditorState', () => {
	it('names new elements R1, R2 and takes the first source as input', () => {
		const { s, v } = divider();
		s.addItem('R', 0, 0);
		expect(s.items.filter((i) => i.kind === 'R').map((i) => i.name)).toEqual(['R1', 'R2']);
		expect(s.input).toBe(v);
	});

	it('undo and redo walk every change back and forth', () => {
		const { s } = divider();
		expect(s.wires).toHaveLength(2);
		s.undo();
		expect(s.wires).toHaveLength(1);
		s.undo();
		s.undo();
		expect(s.items).toHaveLength(2);
		s.redo();
		s.redo();
		s.redo();
		expect(s.items).toHaveLength(3);
		expect(s.wires).toHaveLength(2);
		expect(s.canRedo).toBe(false);
	});

	it('typing a value folds into one undo step', () => {
		const { s, r } = divider();
		for (const v of ['9', '9.', '9.1', '9.1M']) s.updateItem(r, { value: v }, `value:${r}`);
		expect(s.items.find((i) => i.id === r)!.value).toBe('9.1M');
		s.undo();
		expect(s.items.find((i) => i.id === r)!.value).toBe('1k');
	});

	it('refuses a duplicate name and renames the control of dependent sources', () => {
		const { s, r, v } = divider();
		const r2 = s.addItem('R', 0, 0)!;
		expect(s.rename(r2, 'R1')).toMatch(/already/);
		const f = s.addItem('CCCS', 0, 0)!;
		expect(s.items.find((i) => i.id === f)!.control).toBe('V1');
		expect(s.rename(v, 'Vsig')).toBeNull();
		expect(s.items.find((i) => i.id === f)!.control).toBe('Vsig');
		expect(s.rename(r, '')).toMatch(/empty/);
	});

	it('copy/paste makes new names and keeps the wires between copied parts', () => {
		const { s, v, r } = divider();
		s.select([v, r]);
		s.copy();
		s.paste();
		expect(s.items.filter((i) => i.kind === 'R').map((i) => i.name)).toEqual(['R1', 'R2']);
		expect(s.items.filter((i) => i.kind === 'V').map((i) => i.name)).toEqual(['V1', 'V2']);
		expect(s.wires).toHaveLength(3);
		expect(s.selected).toHaveLength(2);
	});

	it('delete takes the wires of deleted parts and clears a deleted input', () => {
		const { s, v } = divider();
		s.select([v]);
		s.deleteSelected();
		expect(s.wires).toHaveLength(0);
		expect(s.input).toBeNull();
		s.undo();
		expect(s.input).toBe(v);
	});

	it('rotate and mirror act on the selection and undo', () => {
		const { s, r } = divider();
		s.select([r]);
		s.rotateSelected();
		s.flipSelected();
		expect(s.items.find((i) => i.id === r)).toMatchObject({ rotation: 90, flip: true });
		s.undo();
		s.undo();
		expect(s.items.find((i) => i.id === r)).toMatchObject({ rotation: 0, flip: false });
	});

	it('the output can be chosen by net name; the marker is placed and wired', () => {
		const { s, r } = divider();
		const net = s.built.nets.byTerminal.get(`${r}:b`)!;
		s.setOutputTerminal('pos', net);
		expect(s.built.document.output).toEqual({ node: net, reference: 'gnd' });
		expect(s.built.problems).toEqual([]);
	});

	it('setValues changes several values as one undo step, by element name', () => {
		const { s, r } = divider();
		const c = s.addItem('C', 200, 0)!;
		const before = s.version;
		expect(s.setValues({ R1: '8.2M', C1: '39p', Vx: '1', GND: '1' })).toEqual(['R1', 'C1']);
		expect(s.version).toBe(before + 1);
		expect(s.items.find((i) => i.id === r)!.value).toBe('8.2M');
		expect(s.items.find((i) => i.id === c)!.value).toBe('39p');
		expect(s.built.document.elements.find((e) => e.id === 'C1')!.value).toBe('39p');
		s.undo();
		expect(s.items.find((i) => i.id === r)!.value).toBe('1k');
		expect(s.items.find((i) => i.id === c)!.value).toBe('10p');
		// The step before is the capacitor being placed: one more undo removes it.
		s.undo();
		expect(s.items.some((i) => i.id === c)).toBe(false);
		s.redo();
		s.redo();
		expect(s.items.find((i) => i.id === r)!.value).toBe('8.2M');
	});

	it('setValues records nothing when no value changes, and nothing when read-only', () => {
		const { s } = divider();
		const before = s.version;
		expect(s.setValues({ R1: ' 1k ', Rnone: '5' })).toEqual([]);
		expect(s.version).toBe(before);
		s.readonly = true;
		expect(s.setValues({ R1: '2k' })).toEqual([]);
		expect(s.items.find((i) => i.name === 'R1')!.value).toBe('1k');
	});

	it('a read-only editor ignores edits', () => {
		const { s } = divider();
		s.readonly = true;
		s.addItem('C', 0, 0);
		expect(s.items).toHaveLength(3);
	});
});

import { describe, expect, it } from 'vitest';
import {
	addGroup,
	addOption,
	dropElements,
	inOption,
	removeOption,
	renameElement,
	setInBase,
	setInOption,
	setOptionValue,
	variantNameProblem
} from './variant-edits';
import { EditorState } from './editor-state.svelte';
import { fromDocument } from './from-document';
import { listVariants } from '$lib/network/variants';
import type { NetworkDocument } from '$lib/network/schema';

describe('variant edits', () => {
	it('builds a group, values, in/out per option, and tidies empty parts away', () => {
		let v = addGroup(null, 'Range');
		expect(v).toEqual({
			groups: [{ name: 'Range', options: [{ name: 'as drawn' }, { name: 'option 2' }] }]
		});
		v = setOptionValue(v, 0, 1, 'R1', ' 9.9M ');
		v = setInOption(v, 0, 1, 'C9', false);
		expect(v!.groups[0].options[1]).toEqual({
			name: 'option 2',
			values: { R1: '9.9M' },
			absent: ['C9']
		});
		expect(inOption(v, 0, 1, 'C9')).toBe(false);
		expect(inOption(v, 0, 0, 'C9')).toBe(true);
		// A part out of the base, put in by one option only.
		v = setInBase(v, 'Rsh', false);
		v = setInOption(v, 0, 1, 'Rsh', true);
		expect(v!.absent).toEqual(['Rsh']);
		expect(inOption(v, 0, 0, 'Rsh')).toBe(false);
		expect(inOption(v, 0, 1, 'Rsh')).toBe(true);
		// Back in the base: the option's "present" has nothing left to do and is dropped.
		v = setInBase(v, 'Rsh', true);
		expect(v!.absent).toBeUndefined();
		expect(v!.groups[0].options[1].present).toBeUndefined();
		// Clearing the value and the absence leaves a bare option.
		v = setOptionValue(v, 0, 1, 'R1', '');
		v = setInOption(v, 0, 1, 'C9', true);
		expect(v!.groups[0].options[1]).toEqual({ name: 'option 2' });
	});

	it('renamed parts keep their overrides, deleted ones lose them; the last option removes its group', () => {
		let v = setOptionValue(addGroup(null, 'Range'), 0, 1, 'R1', '2k');
		v = setInBase(v, 'C1', false);
		v = renameElement(v, 'R1', 'Rtop');
		expect(v!.groups[0].options[1].values).toEqual({ Rtop: '2k' });
		v = dropElements(v, new Set(['Rtop', 'C1']));
		expect(v).toEqual({
			groups: [{ name: 'Range', options: [{ name: 'as drawn' }, { name: 'option 2' }] }]
		});
		v = addOption(v, 0);
		expect(v!.groups[0].options.map((o) => o.name)).toEqual(['as drawn', 'option 2', 'option 3']);
		v = setInBase(v, 'C1', false);
		v = removeOption(removeOption(removeOption(v, 0, 2), 0, 1), 0, 0);
		// The last group gone: the part left out of the base is back in the network.
		expect(v).toBeNull();
	});

	it('refuses names that are empty, taken, too long or carry the joining dot', () => {
		expect(variantNameProblem(' ', [])).toBe('a name is needed');
		expect(variantNameProblem('×10', ['×10'])).toBe('“×10” is taken');
		expect(variantNameProblem('a · b', [])).toMatch(/joins option names/);
		expect(variantNameProblem('x'.repeat(41), [])).toBe('at most 40 characters');
		expect(variantNameProblem('×100', ['×10'])).toBeNull();
	});
});

describe('the editor with variants', () => {
	const doc: NetworkDocument = {
		schema: 1,
		elements: [
			{ id: 'V1', type: 'V', nodes: ['in', 'gnd'], value: 1 },
			{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '9M' },
			{ id: 'C1', type: 'C', nodes: ['in', 'out'], value: '6.8p' },
			{ id: 'R2', type: 'R', nodes: ['out', 'gnd'], value: '1M' }
		],
		input: 'V1',
		output: { node: 'out' },
		variants: {
			groups: [
				{
					name: 'Range',
					options: [{ name: '10:1' }, { name: '100:1', values: { R1: '9.9M', C1: '6.2p' } }]
				}
			]
		}
	};

	it('keeps the variants through opening, building and undo', () => {
		const e = new EditorState();
		e.load(fromDocument(doc));
		expect(e.built.document.variants).toEqual(doc.variants);
		expect(listVariants(e.built.document).map((v) => v.name)).toEqual(['10:1', '100:1']);
		e.setVariants(addOption(e.variants, 0, '1000:1'));
		expect(e.variant!.list).toHaveLength(3);
		e.undo();
		expect(e.variant!.list).toHaveLength(2);
	});

	it('values written for the picked variant go to the option that sets them; shared ones to the drawing', () => {
		const e = new EditorState();
		e.load(fromDocument(doc));
		e.pickOption(0, 1);
		expect(e.variant!.info.name).toBe('100:1');
		// C1 is 100:1's own (its option sets it); R2 is shared by both positions.
		expect(e.setValues({ C1: '6.06p', R2: '1.1M' })).toEqual(['C1', 'R2']);
		expect(e.variants!.groups[0].options[1].values).toEqual({ R1: '9.9M', C1: '6.06p' });
		expect(e.items.find((i) => i.name === 'C1')!.value).toBe('6.8p');
		expect(e.items.find((i) => i.name === 'R2')!.value).toBe('1.1M');
		// One undo step takes both back.
		e.undo();
		expect(e.variants!.groups[0].options[1].values!.C1).toBe('6.2p');
		expect(e.items.find((i) => i.name === 'R2')!.value).toBe('1M');
	});

	it('renaming a part carries its overrides; deleting it drops them', () => {
		const e = new EditorState();
		e.load(fromDocument(doc));
		const c1 = e.items.find((i) => i.name === 'C1')!;
		expect(e.rename(c1.id, 'Ctop')).toBeNull();
		expect(e.variants!.groups[0].options[1].values).toEqual({ R1: '9.9M', Ctop: '6.2p' });
		e.select([c1.id]);
		e.deleteSelected();
		expect(e.variants!.groups[0].options[1].values).toEqual({ R1: '9.9M' });
	});
});

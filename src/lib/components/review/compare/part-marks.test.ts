import { describe, expect, it } from 'vitest';
import { partMarks } from './part-marks';

const diff = {
	added: [{ id: 'C2' }],
	removed: [{ id: 'RL' }],
	changed: [
		{ id: 'R1', type: 'R', changes: [{ field: 'value', from: '1k', to: '2k' }] },
		{
			id: 'C1',
			changes: [
				{ field: 'nodes', from: 'out, gnd', to: 'in, gnd' },
				{ field: 'type', from: 'C', to: 'L' }
			]
		}
	]
};

describe('partMarks', () => {
	it('older side: removed parts and where a change went', () => {
		expect([...partMarks(diff, 'older')]).toEqual([
			['RL', { kind: 'removed', words: 'removed' }],
			['R1', { kind: 'changed', words: 'changed: → 2 kΩ' }],
			['C1', { kind: 'changed', words: 'changed: wiring, kind → L' }]
		]);
	});

	it('newer side: added parts and where a change came from', () => {
		expect([...partMarks(diff, 'newer')]).toEqual([
			['C2', { kind: 'added', words: 'added' }],
			['R1', { kind: 'changed', words: 'changed: was 1 kΩ' }],
			['C1', { kind: 'changed', words: 'changed: wiring, kind was C' }]
		]);
	});

	it('nothing changed: no marks', () => {
		expect(partMarks({ added: [], removed: [], changed: [] }, 'older').size).toBe(0);
	});
});

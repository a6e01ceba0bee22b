// The written file against the version 1.1 layout (Touchstone File Format Specification, IBIS
// Open Forum): comments start with "!", one option line "# <unit> <parameter> <format> R <n>",
// then per frequency one line of the frequency and 8 numbers in the 2-port order N11 N21 N12 N22.
import { describe, expect, it } from 'vitest';
import { asciiComment, frequencyList, writeTouchstone } from './touchstone';
import type { M2 } from './complex2';

const c = (re: number, im = 0) => ({ re, im });
const m: M2 = [
	[c(0.11, 0.12), c(0.21, 0.22)],
	[c(0.31, 0.32), c(0.41, 0.42)]
];

describe('Touchstone writer', () => {
	it('writes comments, the option line and 2-port data lines in the order S11 S21 S12 S22', () => {
		const text = writeTouchstone({
			parameter: 'S',
			format: 'RI',
			unit: 'MHz',
			z0: 50,
			f: [1e6, 2.5e6],
			values: [m, m],
			comments: ['Sheet: probe — 10:1']
		});
		const lines = text.split('\r\n');
		expect(lines.at(-1)).toBe('');
		expect(lines[0]).toBe('! Sheet: probe - 10:1');
		expect(lines[1]).toBe('# MHz S RI R 50');
		const data = lines.filter((l) => l && !l.startsWith('!') && !l.startsWith('#'));
		expect(data).toHaveLength(2);
		const numbers = data[1].split(' ').map(Number);
		expect(numbers).toHaveLength(9);
		expect(numbers[0]).toBe(2.5);
		// S11 (0.11, 0.12), S21 = m[1][0] (0.31, 0.32), S12 = m[0][1] (0.21, 0.22), S22 (0.41, 0.42)
		expect(numbers.slice(1)).toEqual([0.11, 0.12, 0.31, 0.32, 0.21, 0.22, 0.41, 0.42]);
		expect(/^[\x20-\x7e\r\n]*$/.test(text)).toBe(true);
	});

	it('MA and DB give magnitude or 20·log10|x| with the angle in degrees', () => {
		const one: M2 = [
			[c(0, 1), c(0.1)],
			[c(0.1), c(-1)]
		];
		const ma = writeTouchstone({
			parameter: 'S',
			format: 'MA',
			unit: 'Hz',
			z0: 75,
			f: [1],
			values: [one],
			comments: []
		}).split('\r\n');
		expect(ma[0]).toBe('# Hz S MA R 75');
		expect(ma[2].split(' ').map(Number)).toEqual([1, 1, 90, 0.1, 0, 0.1, 0, 1, 180]);
		const db = writeTouchstone({
			parameter: 'S',
			format: 'DB',
			unit: 'Hz',
			z0: 50,
			f: [1],
			values: [one],
			comments: []
		}).split('\r\n');
		expect(db[2].split(' ').map(Number)).toEqual([1, 0, 90, -20, 0, -20, 0, 0, 180]);
	});

	it('normalizes Z by R and Y by 1/R, as version 1.x files are', () => {
		const z: M2 = [
			[c(100), c(50)],
			[c(50), c(100)]
		];
		const lines = writeTouchstone({
			parameter: 'Z',
			format: 'RI',
			unit: 'Hz',
			z0: 50,
			f: [10],
			values: [z],
			comments: []
		}).split('\r\n');
		expect(lines[0]).toMatch(/^! Z-parameters normalized to R = 50 ohm/);
		expect(lines[1]).toBe('# Hz Z RI R 50');
		expect(lines[3].split(' ').map(Number)).toEqual([10, 2, 0, 1, 0, 1, 0, 2, 0]);
	});

	// Touchstone File Format Specification Version 2.0 (IBIS Open Forum, ratified April 24, 2009):
	// [Version] 2.0 first (comments may come before it), the option line, [Number of Ports], then
	// [Two-Port Data Order] (required for 2-ports: 21_12 means N11 N21 N12 N22), [Number of
	// Frequencies], [Reference] (one resistance per port), [Network Data] … [End].
	it('version 2.0: keywords in the order the 2.0 specification gives, 21_12 data order, [End] last', () => {
		const text = writeTouchstone({
			parameter: 'S',
			format: 'RI',
			unit: 'MHz',
			z0: 75,
			version: '2.0',
			f: [1e6, 2.5e6],
			values: [m, m],
			comments: ['Sheet: probe']
		});
		expect(text.endsWith('[End]\r\n')).toBe(true);
		const lines = text.split('\r\n').filter((l) => l && !l.startsWith('!'));
		expect(lines.slice(0, 7)).toEqual([
			'[Version] 2.0',
			'# MHz S RI R 75',
			'[Number of Ports] 2',
			'[Two-Port Data Order] 21_12',
			'[Number of Frequencies] 2',
			'[Reference] 75 75',
			'[Network Data]'
		]);
		expect(lines.at(-1)).toBe('[End]');
		const data = lines.slice(7, -1);
		expect(data).toHaveLength(2);
		// 21_12: N11 N21 N12 N22 — S21 is m[1][0] (0.31, 0.32), S12 is m[0][1] (0.21, 0.22).
		expect(data[1].split(' ').map(Number)).toEqual([
			2.5, 0.11, 0.12, 0.31, 0.32, 0.21, 0.22, 0.41, 0.42
		]);
		expect(/^[\x20-\x7e\r\n]*$/.test(text)).toBe(true);
	});

	it('version 2.0 writes Z in ohms and Y in siemens, not normalized (2.0 specification)', () => {
		const z: M2 = [
			[c(100), c(50)],
			[c(50), c(100)]
		];
		const lines = (parameter: 'Z' | 'Y', values: M2) =>
			writeTouchstone({
				parameter,
				format: 'RI',
				unit: 'Hz',
				z0: 50,
				version: '2.0',
				f: [10],
				values: [values],
				comments: []
			}).split('\r\n');
		const zl = lines('Z', z);
		expect(zl[0]).toBe('! Z-parameters in ohms, not normalized (Touchstone 2.0)');
		expect(zl).toContain('# Hz Z RI R 50');
		expect(zl[zl.indexOf('[Network Data]') + 2].split(' ').map(Number)).toEqual([
			10, 100, 0, 50, 0, 50, 0, 100, 0
		]);
		const y: M2 = [
			[c(0.02), c(-0.01)],
			[c(-0.01), c(0.02)]
		];
		const yl = lines('Y', y);
		expect(yl[yl.indexOf('[Network Data]') + 2].split(' ').map(Number)).toEqual([
			10, 0.02, 0, -0.01, 0, -0.01, 0, 0.02, 0
		]);
	});

	it('keeps comments to printable ASCII', () => {
		expect(asciiComment('9 MΩ ∥ 10 pF — µ')).toBe('9 MOhm || 10 pF - u');
		expect(asciiComment('Ünïcode ✓')).toBe('Unicode ?');
	});

	it('spaces frequency lists with both ends included', () => {
		const f = frequencyList({ fMin: 1e3, fMax: 1e6, points: 4 });
		expect(f.map((x) => Math.round(x))).toEqual([1e3, 1e4, 1e5, 1e6]);
		expect(frequencyList({ fMin: 1, fMax: 3, points: 3, spacing: 'linear' })).toEqual([1, 2, 3]);
		expect(frequencyList({ list: [5, 1, 3] })).toEqual([1, 3, 5]);
	});
});

// Polarity and pin signs drawn upright beside a symbol whatever its rotation (text never turns).
import type { ItemKind } from '$lib/editor/kinds';

export const SIGNS: Partial<Record<ItemKind, { x: number; y: number; text: string }[]>> = {
	V: [{ x: 30, y: 10, text: '+' }],
	I: [],
	OPAMP: [
		{ x: 18, y: 20, text: '−' },
		{ x: 18, y: 60, text: '+' }
	],
	VCCS: [
		{ x: 6, y: 12, text: '+' },
		{ x: 6, y: 72, text: '−' },
		{ x: 70, y: 10, text: '+' }
	],
	VCVS: [
		{ x: 6, y: 12, text: '+' },
		{ x: 6, y: 72, text: '−' },
		{ x: 70, y: 10, text: '+' }
	],
	CCCS: [{ x: 30, y: 10, text: '+' }],
	CCVS: [{ x: 30, y: 10, text: '+' }],
	PROBE: [
		{ x: 8, y: 14, text: '+' },
		{ x: 8, y: 54, text: '−' }
	]
};

// Where a part's comment marker sits: a small badge in a corner of the part's own box, never in
// its name/value labels (above a wide box, right of a tall one) and never on a conductor or a
// terminal. The corner follows the box as it turns: the first clear one of bottom-right,
// bottom-left, top-right, top-left, so a horizontal R, C or L has it under its right-hand lead
// and an upright one beside its lower lead, whatever the quarter turn or mirroring. The square
// boxes (controlled sources) have leads near every corner: there the badge moves along the
// bottom edge, a third of the way in.
import {
	boxSize,
	placedTerminals,
	transformPoint,
	type PlacedTerminal
} from '$lib/editor/geometry';
import type { EditorItem } from '$lib/editor/types';
import { SIGNS } from './symbol-signs';

export const MARKER_BOX = { width: 18, height: 13 };
/** Clearance from a terminal's line: the ring's radius (4.5 px) plus a little air. */
const CLEAR = 5;

type Rect = { x: number; y: number; width: number; height: number };

/** Where each symbol body draws, as boxes in its unrotated frame (see symbol-body.svelte). */
const BODIES: Partial<Record<EditorItem['kind'], [number, number, number, number][]>> = {
	R: [[18, 11, 44, 18]],
	C: [[34, 5, 12, 30]],
	L: [[17, 7, 46, 14]],
	V: [[3, 23, 34, 34]],
	I: [[3, 23, 41, 34]],
	VCCS: [
		[12, 23, 4, 34],
		[43, 23, 34, 34]
	],
	VCVS: [
		[12, 23, 4, 34],
		[43, 23, 34, 34]
	],
	CCCS: [[3, 23, 34, 34]],
	CCVS: [[3, 23, 34, 34]],
	// The triangle: its upright back edge, and the middle band the slanted edges cross.
	OPAMP: [
		[8, 2, 4, 76],
		[10, 24, 64, 32]
	]
};

function turnedBox(item: Pick<EditorItem, 'kind' | 'rotation' | 'flip'>, [x, y, w, h]: number[]) {
	const a = transformPoint(item.kind, item.rotation, item.flip, x, y);
	const b = transformPoint(item.kind, item.rotation, item.flip, x + w, y + h);
	return {
		x0: Math.min(a.x, b.x),
		y0: Math.min(a.y, b.y),
		x1: Math.max(a.x, b.x),
		y1: Math.max(a.y, b.y)
	};
}

export function markerRect(item: Pick<EditorItem, 'kind' | 'rotation' | 'flip'>): Rect {
	const { width: w, height: h } = boxSize(item.kind, item.rotation);
	const { width: mw, height: mh } = MARKER_BOX;
	// Up to 4 px outside the box on the left, 2 px on the right (the labels of a tall box start
	// 4 px to its right), flush with the bottom and top.
	const left = -4;
	const right = w - mw + 2;
	const bottom = h - mh + 1;
	const top = -1;
	const spots: [number, number][] = [
		[right, bottom],
		[left, bottom],
		[right, top],
		[left, top],
		[w / 3 - mw / 2, bottom],
		[(2 * w) / 3 - mw / 2, bottom]
	];
	const terminals = placedTerminals(item);
	const signs = (SIGNS[item.kind] ?? []).map((g) =>
		transformPoint(item.kind, item.rotation, item.flip, g.x, g.y)
	);
	const { x: midX, y: midY } = { x: w / 2, y: h / 2 };
	// A lead runs from its terminal at most to the middle of the box.
	const offLead = (t: PlacedTerminal, x: number, y: number) => {
		const across = t.side === 'left' || t.side === 'right';
		const [lo, hi] = across ? [x, x + mw] : [y, y + mh];
		const [a, b] = across
			? [Math.min(t.x, midX), Math.max(t.x, midX)]
			: [Math.min(t.y, midY), Math.max(t.y, midY)];
		if (hi <= a || lo >= b) return true;
		return across
			? Math.abs(t.y - (y + mh / 2)) >= mh / 2 + CLEAR
			: Math.abs(t.x - (x + mw / 2)) >= mw / 2 + CLEAR;
	};
	const bodies = (BODIES[item.kind] ?? []).map((b) => turnedBox(item, b));
	const clear = ([x, y]: [number, number]) =>
		terminals.every((t) => offLead(t, x, y)) &&
		bodies.every((b) => x + mw <= b.x0 || x >= b.x1 || y + mh <= b.y0 || y >= b.y1) &&
		// A sign is one upright character, about 8 × 11 px around its point.
		signs.every(
			(g) =>
				Math.abs(g.x - (x + mw / 2)) >= mw / 2 + 4 || Math.abs(g.y - (y + mh / 2)) >= mh / 2 + 6
		);
	const [x, y] = (spots.find(clear) ?? spots[0]).map(Math.round);
	return { x, y, width: mw, height: mh };
}

import { describe, expect, it } from 'vitest';
import { boxSize, placedTerminals } from '$lib/editor/geometry';
import { KINDS, isCircuit, type ItemKind } from '$lib/editor/kinds';
import type { Rotation } from '$lib/editor/types';
import { transformPoint } from '$lib/editor/geometry';
import { markerRect } from './marker-spot';
import { SIGNS } from './symbol-signs';

const kinds = (Object.keys(KINDS) as ItemKind[]).filter(isCircuit);
const turns: Rotation[] = [0, 90, 180, 270];
const placements = kinds.flatMap((kind) =>
	turns.flatMap((rotation) => [false, true].map((flip) => ({ kind, rotation, flip })))
);

describe('comment marker spot on a canvas part', () => {
	it.each(placements)('$kind at $rotation° (mirrored: $flip) keeps off leads and labels', (p) => {
		const r = markerRect(p);
		const { width: w, height: h } = boxSize(p.kind, p.rotation);
		// Inside the part's own box, give or take a few pixels.
		expect(r.x).toBeGreaterThanOrEqual(-4);
		expect(r.x + r.width).toBeLessThanOrEqual(w + 2);
		expect(r.y).toBeGreaterThanOrEqual(-1);
		expect(r.y + r.height).toBeLessThanOrEqual(h + 1);
		// Off every terminal ring and its lead (which reaches at most the middle of the box): the
		// badge, grown by 5 px, must not hold any point of the segment terminal → middle.
		for (const t of placedTerminals(p)) {
			const end =
				t.side === 'left' || t.side === 'right' ? { x: w / 2, y: t.y } : { x: t.x, y: h / 2 };
			for (let k = 0; k <= 20; k++) {
				const q = { x: t.x + ((end.x - t.x) * k) / 20, y: t.y + ((end.y - t.y) * k) / 20 };
				const inside =
					q.x > r.x - 5 && q.x < r.x + r.width + 5 && q.y > r.y - 5 && q.y < r.y + r.height + 5;
				expect(inside, `${t.name} lead at (${q.x}, ${q.y})`).toBe(false);
			}
		}
		// Off the upright polarity signs.
		for (const g of SIGNS[p.kind] ?? []) {
			const q = transformPoint(p.kind, p.rotation, p.flip, g.x, g.y);
			const apart =
				Math.abs(q.x - (r.x + r.width / 2)) >= r.width / 2 + 4 ||
				Math.abs(q.y - (r.y + r.height / 2)) >= r.height / 2 + 6;
			expect(apart).toBe(true);
		}
		// Never where the labels are: above a wide box (bottom half instead), right of a tall one.
		if (w > h) expect(r.y).toBeGreaterThan(h / 2);
		else expect(r.x + r.width).toBeLessThanOrEqual(w + 2);
	});

	it('follows the turn: a resistor has it under its right lead lying, beside its lower lead standing', () => {
		for (const flip of [false, true]) {
			for (const rotation of [0, 180] as const) {
				expect(markerRect({ kind: 'R', rotation, flip })).toMatchObject({ x: 64, y: 28 });
			}
			for (const rotation of [90, 270] as const) {
				expect(markerRect({ kind: 'R', rotation, flip })).toMatchObject({ x: -4, y: 68 });
			}
		}
	});
});

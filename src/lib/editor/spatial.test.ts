import { describe, expect, it } from 'vitest';
import { freeSpot, nearestInDirection, readingOrder } from './spatial';
import type { EditorItem } from './types';

const at = (id: string, x: number, y: number): EditorItem => ({
	id,
	kind: 'R',
	name: id,
	value: '1k',
	x,
	y,
	rotation: 0,
	flip: false
});

describe('moving the focus between parts', () => {
	// A cross: centre c, with parts to its right (far, straight), right-and-up (near, 30° off)
	// and one below.
	const items = [at('c', 0, 0), at('far', 400, 0), at('near', 120, -60), at('below', 0, 200)];

	it('goes to the nearest part in the direction, preferring one straight ahead', () => {
		expect(nearestInDirection(items, 'c', 'right')?.id).toBe('near');
		expect(nearestInDirection(items, 'c', 'down')?.id).toBe('below');
		expect(nearestInDirection(items, 'near', 'right')?.id).toBe('far');
	});

	it('reaches a part that lies far off the axis, and stops at the edge', () => {
		const two = [at('a', 0, 0), at('b', 40, 300)];
		expect(nearestInDirection(two, 'a', 'right')?.id).toBe('b');
		expect(nearestInDirection(two, 'a', 'left')).toBeNull();
		expect(nearestInDirection(two, 'missing', 'left')).toBeNull();
	});

	it('lists parts in reading order: rows, then left to right', () => {
		expect(readingOrder(items).map((i) => i.id)).toEqual(['near', 'c', 'far', 'below']);
	});
});

describe('a free spot for a new part', () => {
	it('is the centre when nothing is there, and clear of a part that is', () => {
		const size = { width: 80, height: 40 };
		expect(freeSpot([], size, 100, 100)).toEqual({ x: 60, y: 80 });
		const spot = freeSpot([at('a', 60, 80)], size, 100, 100);
		const apart =
			spot.x >= 60 + 80 + 20 ||
			spot.x + 80 + 20 <= 60 ||
			spot.y >= 80 + 40 + 20 ||
			spot.y + 40 + 20 <= 80;
		expect(apart).toBe(true);
		expect(Math.hypot(spot.x - 60, spot.y - 80)).toBeLessThanOrEqual(Math.hypot(120, 80));
	});
});

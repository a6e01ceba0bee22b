// Moving the keyboard focus between parts on the canvas: the arrow keys go to the nearest part
// in that direction (a part straight ahead beats a nearer one off to the side), Home and End to
// the first and last in reading order.
import { boxSize } from './geometry';
import type { EditorItem } from './types';

export type Direction = 'left' | 'right' | 'up' | 'down';

const centre = (i: EditorItem) => {
	const s = boxSize(i.kind, i.rotation);
	return { x: i.x + s.width / 2, y: i.y + s.height / 2 };
};

/** The nearest item from `fromId` in `dir`, or null when there is none that way. */
export function nearestInDirection(
	items: EditorItem[],
	fromId: string,
	dir: Direction
): EditorItem | null {
	const from = items.find((i) => i.id === fromId);
	if (!from) return null;
	const c = centre(from);
	// First what lies within 45° either side of the direction; failing that, anything on that
	// side, so every part can be reached.
	for (const cone of [true, false]) {
		let best: EditorItem | null = null;
		let bestScore = Infinity;
		for (const it of items) {
			if (it.id === from.id) continue;
			const p = centre(it);
			const dx = p.x - c.x;
			const dy = p.y - c.y;
			const ahead = dir === 'right' ? dx : dir === 'left' ? -dx : dir === 'down' ? dy : -dy;
			const aside = dir === 'left' || dir === 'right' ? Math.abs(dy) : Math.abs(dx);
			if (ahead <= 0 || (cone && aside > ahead)) continue;
			const score = ahead + 2 * aside;
			if (score < bestScore) {
				bestScore = score;
				best = it;
			}
		}
		if (best) return best;
	}
	return null;
}

/** Items in reading order: top to bottom in bands of one grid row, then left to right. */
export function readingOrder(items: EditorItem[]): EditorItem[] {
	return [...items].sort((a, b) => {
		const ca = centre(a);
		const cb = centre(b);
		return Math.round(ca.y / 40) - Math.round(cb.y / 40) || ca.x - cb.x;
	});
}

/**
 * A spot for a new part of `size` near (x, y), its top-left on the grid, clear of every item's
 * box by one grid step: parts dropped one after another in the middle of the view (the
 * keyboard's way) must not land on top of each other.
 */
export function freeSpot(
	items: EditorItem[],
	size: { width: number; height: number },
	x: number,
	y: number,
	grid = 20
): { x: number; y: number } {
	const boxes = items.map((i) => ({ ...boxSize(i.kind, i.rotation), x: i.x, y: i.y }));
	const clear = (px: number, py: number) =>
		boxes.every(
			(b) =>
				px + size.width + grid <= b.x ||
				b.x + b.width + grid <= px ||
				py + size.height + grid <= b.y ||
				b.y + b.height + grid <= py
		);
	const x0 = Math.round((x - size.width / 2) / grid) * grid;
	const y0 = Math.round((y - size.height / 2) / grid) * grid;
	// Rings of growing radius around the centre, nearest first.
	for (let r = 0; r <= 40; r++) {
		for (let dy = -r; dy <= r; dy++)
			for (let dx = -r; dx <= r; dx++) {
				if (Math.max(Math.abs(dx), Math.abs(dy)) !== r) continue;
				const px = x0 + dx * grid * 2;
				const py = y0 + dy * grid * 2;
				if (clear(px, py)) return { x: px, y: py };
			}
	}
	return { x: x0, y: y0 };
}

// Rotation and mirroring of symbol boxes. Mirroring (about the vertical axis) is applied first,
// then a clockwise rotation; text is never transformed so it stays upright.
import { KINDS, type ItemKind } from './kinds';
import type { EditorItem, Rotation } from './types';

export type Side = 'left' | 'right' | 'top' | 'bottom';

export function boxSize(kind: ItemKind, rotation: Rotation): { width: number; height: number } {
	const { width, height } = KINDS[kind];
	return rotation === 90 || rotation === 270 ? { width: height, height: width } : { width, height };
}

/** Maps a point of the unrotated box to the rotated/mirrored box. */
export function transformPoint(
	kind: ItemKind,
	rotation: Rotation,
	flip: boolean,
	x: number,
	y: number
): { x: number; y: number } {
	const { width: w, height: h } = KINDS[kind];
	const fx = flip ? w - x : x;
	switch (rotation) {
		case 90:
			return { x: h - y, y: fx };
		case 180:
			return { x: w - fx, y: h - y };
		case 270:
			return { x: y, y: w - fx };
		default:
			return { x: fx, y };
	}
}

/** The same transform as an SVG matrix, for drawing the symbol body. */
export function svgTransform(kind: ItemKind, rotation: Rotation, flip: boolean): string {
	const { width: w, height: h } = KINDS[kind];
	const [a, b, c, d, e, f] =
		rotation === 90
			? [0, 1, -1, 0, h, 0]
			: rotation === 180
				? [-1, 0, 0, -1, w, h]
				: rotation === 270
					? [0, -1, 1, 0, 0, w]
					: [1, 0, 0, 1, 0, 0];
	// Compose rotation ∘ mirror: mirror is x → w − x.
	const m = flip ? [-a, -b, c, d, a * w + e, b * w + f] : [a, b, c, d, e, f];
	return `matrix(${m.join(' ')})`;
}

export interface PlacedTerminal {
	name: string;
	label: string;
	x: number;
	y: number;
	side: Side;
}

export function placedTerminals(
	item: Pick<EditorItem, 'kind' | 'rotation' | 'flip'>
): PlacedTerminal[] {
	const { width } = boxSize(item.kind, item.rotation);
	return KINDS[item.kind].terminals.map((t) => {
		const p = transformPoint(item.kind, item.rotation, item.flip, t.x, t.y);
		const side: Side = p.x <= 0 ? 'left' : p.x >= width ? 'right' : p.y <= 0 ? 'top' : 'bottom';
		return { name: t.name, label: t.label, x: p.x, y: p.y, side };
	});
}

/** Absolute canvas position of one terminal. */
export function terminalPosition(item: EditorItem, terminal: string): { x: number; y: number } {
	const t = placedTerminals(item).find((p) => p.name === terminal);
	return t ? { x: item.x + t.x, y: item.y + t.y } : { x: item.x, y: item.y };
}

export const snap = (v: number, grid = 20) => Math.round(v / grid) * grid;

export const nextRotation = (r: Rotation): Rotation => ((r + 90) % 360) as Rotation;

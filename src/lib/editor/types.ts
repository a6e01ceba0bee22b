import type { PartRole } from '$lib/network/schema';
import type { ItemKind } from './kinds';
import type { VariantSet } from '$lib/network/variant-schema';

export type Rotation = 0 | 90 | 180 | 270;

/** One thing on the canvas. `id` is internal and stable; `name` is the network element id. */
export interface EditorItem {
	id: string;
	kind: ItemKind;
	/** Element id in the network document (circuit kinds); the net's name for LABEL. */
	name: string;
	/** As typed by the person; parsed only when the document is built. */
	value: string;
	/** Name of the controlling V element (CCCS / CCVS). */
	control?: string;
	/** What the value is to the designer (absent: a design value); see the network schema. */
	role?: PartRole;
	/** A trimmer's adjustment range as typed ("5p" … "15p"). */
	range?: { min: string; max: string };
	/** Relative tolerance as typed, e.g. "1%"; kept for the design aids. */
	tolerance?: string;
	notes?: string;
	x: number;
	y: number;
	rotation: Rotation;
	flip: boolean;
}

export interface TerminalRef {
	item: string;
	terminal: string;
}

export interface Wire {
	id: string;
	from: TerminalRef;
	to: TerminalRef;
}

/** Everything undo/redo restores. Arrays are treated as immutable. */
export interface Snapshot {
	title: string;
	items: EditorItem[];
	wires: Wire[];
	/** Item id of the input source, or null. */
	input: string | null;
	/** The sheet's variants (network-format.md), by element name; null or absent: none. */
	variants?: VariantSet | null;
	/** Net names pinned on terminals ("item:terminal" → name); see nets.ts. */
	netNames?: Record<string, string>;
}

/** What is stored in a revision's `layout` column beside the network document. */
export interface SheetLayout {
	format: 'polewise-canvas';
	version: 1;
	items: EditorItem[];
	wires: Wire[];
	input: string | null;
	/** Net names pinned on terminals, so nets keep the names people and documents gave them. */
	netNames?: Record<string, string>;
}

export const terminalKey = (r: TerminalRef) => `${r.item}:${r.terminal}`;

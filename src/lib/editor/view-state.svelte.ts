// What the canvas and the result panels show about each other: the element under the pointer,
// the pole picked in a table, and the element or node a solver error points at. Kept apart from
// EditorState because none of it is part of the drawing or its history. The derived Sets are
// rebuilt whole on each change (never mutated), so plain Sets are right here.
/* eslint-disable svelte/prefer-svelte-reactivity */
import { getContext, setContext } from 'svelte';

export interface Fault {
	message: string;
	element?: string;
	node?: string;
}

export interface PoleOwnerLike {
	owners: { element: string; share: number }[];
}

/** An owner counts when it holds at least this share of a pole (participation factor). */
export const OWNER_SHARE = 0.2;

export class ViewState {
	hoveredElement = $state<string | null>(null);
	pickedPole = $state<number | null>(null);
	fault = $state<Fault | null>(null);
	/** A pole and a zero closer than this fraction of the pole are shown as a doublet. */
	doubletRatio = $state(0.1);
	poles = $state.raw<PoleOwnerLike[]>([]);

	/** Element names to light up on the canvas. */
	readonly litElements = $derived.by(() => {
		const p = this.pickedPole === null ? null : this.poles[this.pickedPole];
		return new Set(p ? p.owners.filter((o) => o.share >= OWNER_SHARE).map((o) => o.element) : []);
	});

	/** Pole indices owned by the hovered element. */
	readonly litPoles = $derived.by(() => {
		const e = this.hoveredElement;
		const out = new Set<number>();
		if (!e) return out;
		this.poles.forEach((p, i) => {
			if (p.owners.some((o) => o.element === e && o.share >= OWNER_SHARE)) out.add(i);
		});
		return out;
	});
}

const KEY = Symbol('polewise-view');
export const setViewContext = (v: ViewState) => setContext(KEY, v);
export const getViewContext = () => getContext<ViewState>(KEY);

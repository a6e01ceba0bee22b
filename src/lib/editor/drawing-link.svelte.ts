// What the panels beside the sheet editor (the design aids) may see and do with the drawing:
// the network as it is on the canvas now, whether that is saved, and one way to change values.
// The sheet page makes one and shares it by context; the workbench attaches its editor and
// autosave. Panels go through this, never into the editor's internals.
import { getContext, setContext } from 'svelte';
import { formatEngineering } from '$lib/solver/notation';
import type { NetworkDocument } from '$lib/network/schema';
import type { Autosave } from './autosave.svelte';
import type { EditorState } from './editor-state.svelte';
import { setOptionValue } from './variant-edits';

export interface DrawingNow {
	document: NetworkDocument;
	/** The first reason the drawing cannot be analysed yet (half-typed value, no input…), or null. */
	problem: string | null;
	/** The saved revision the drawing started from. */
	base: number;
	/** True while the drawing differs from that revision (edits not saved yet). */
	unsaved: boolean;
}

export class DrawingLink {
	#editor = $state.raw<EditorState | null>(null);
	#save = $state.raw<Autosave | null>(null);
	/**
	 * A result panel asking the design aids to solve for one element's value (a doublet's
	 * closing change → "flat response"); `nonce` makes a repeated request for the same element count.
	 */
	solveRequest = $state.raw<{ element: string; nonce: number } | null>(null);

	requestSolve(element: string): void {
		this.solveRequest = { element, nonce: (this.solveRequest?.nonce ?? 0) + 1 };
	}

	/** Returns the detach function (call it when the editor goes away). */
	attach(editor: EditorState, save: Autosave): () => void {
		this.#editor = editor;
		this.#save = save;
		return () => {
			if (this.#editor !== editor) return;
			this.#editor = null;
			this.#save = null;
		};
	}

	/** The editable drawing, or null: none attached, or read-only (viewers keep the saved revision). */
	get now(): DrawingNow | null {
		const editor = this.#editor;
		const save = this.#save;
		if (!editor || !save || editor.readonly) return null;
		const built = editor.built;
		return {
			document: built.document,
			problem: built.problems[0]?.message ?? null,
			base: save.baseRevision,
			unsaved: save.dirty
		};
	}

	/**
	 * The variant picked above the canvas (name and choice), read-only viewers included, or null
	 * when the sheet has no variants or no editor is attached. The design aids run on it.
	 */
	get variant(): { name: string; choice: number[] } | null {
		const v = this.#editor?.variant;
		return v ? { name: v.info.name, choice: v.info.choice } : null;
	}

	/**
	 * Write values (SI units, by element name) into the drawing as one undo step; autosave then
	 * saves it like any edit. Returns the names that changed. With variants, a value the picked
	 * variant sets through an option is written to that option; shared values to the drawing.
	 */
	setValues(values: Record<string, number>): string[] {
		const editor = this.#editor;
		if (!editor || editor.readonly) return [];
		// Six significant digits, typed form ("8.2M", "6.66667p"): what the value field would show.
		const typed = Object.entries(values).map(([name, v]) => [name, formatEngineering(v, '', 6)]);
		return editor.setValues(Object.fromEntries(typed));
	}

	/**
	 * Write one part's value into variant options (a position's own trimmer setting), all in one
	 * undo step; false when there is no editable drawing.
	 */
	setOptionValues(element: string, values: OptionValue[]): boolean {
		const editor = this.#editor;
		if (!editor || editor.readonly || values.length === 0) return false;
		let next = editor.variants;
		for (const v of values)
			next = setOptionValue(next, v.group, v.option, element, formatEngineering(v.value, '', 6));
		editor.setVariants(next);
		return true;
	}
}

/** Values of one part in several options (group index, option index → SI value), one undo step. */
export interface OptionValue {
	group: number;
	option: number;
	value: number;
}

const KEY = Symbol('polewise-drawing-link');
export const setDrawingContext = (link: DrawingLink) => setContext(KEY, link);
/** Undefined outside a sheet page (previews, tests): panels then work on saved revisions. */
export const getDrawingContext = () => getContext<DrawingLink | undefined>(KEY);

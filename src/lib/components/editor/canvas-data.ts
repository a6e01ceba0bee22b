import type { EditorItem } from '$lib/editor/types';
import type { SymbolFamily } from '$lib/editor/preferences.svelte';

/** What a canvas node receives; rebuilt only for nodes whose item or state changed. */
export interface ElementNodeData extends Record<string, unknown> {
	item: EditorItem;
	family: SymbolFamily;
	lit: boolean;
	fault: boolean;
	faultMessage?: string;
	faultTerminals: string[];
	/** Terminals with at least one wire (drawn quietly; open ones show as rings). */
	wiredTerminals: string[];
	/** Terminals where two or more wires meet the lead: a junction, drawn as a solid dot. */
	junctionTerminals: string[];
	isInput: boolean;
	negWired: boolean;
	readonly: boolean;
	normalValue?: string;
	valueError: boolean;
	/** Each terminal in words, for its accessible name ("R1 terminal 2, on tip with C1"). */
	terminalNames: Record<string, string>;
	/** The terminal a keyboard wire starts from, when it is on this item. */
	pendingTerminal: string | null;
	/** Accepted but suspicious (a negative R, C or L): said on the symbol. */
	valueWarning?: string;
	/** The picked variant sets another value ("6.2p"), and the option that sets it ("Range: 100:1"). */
	variantValue?: string;
	variantOption?: string;
	/** Not in the picked variant's network (drawn faintly, with the word "out"). */
	absent?: boolean;
}

export interface WireEdgeData extends Record<string, unknown> {
	fault: boolean;
	net: string;
	/** This wire carries its net's name tag (one wire per net; others show it on hover). */
	nameTag: boolean;
	/** The names are switched on in the toolbar (else the tag shows on hover only). */
	showNames: boolean;
}

export function sameNodeData(a: ElementNodeData, b: ElementNodeData): boolean {
	return (
		a.item === b.item &&
		a.family === b.family &&
		a.lit === b.lit &&
		a.fault === b.fault &&
		a.faultMessage === b.faultMessage &&
		a.faultTerminals.join() === b.faultTerminals.join() &&
		a.wiredTerminals.join() === b.wiredTerminals.join() &&
		a.junctionTerminals.join() === b.junctionTerminals.join() &&
		a.isInput === b.isInput &&
		a.negWired === b.negWired &&
		a.readonly === b.readonly &&
		a.normalValue === b.normalValue &&
		a.valueError === b.valueError &&
		a.valueWarning === b.valueWarning &&
		a.variantValue === b.variantValue &&
		a.variantOption === b.variantOption &&
		a.absent === b.absent &&
		a.pendingTerminal === b.pendingTerminal &&
		Object.entries(a.terminalNames).every(([k, v]) => b.terminalNames[k] === v)
	);
}

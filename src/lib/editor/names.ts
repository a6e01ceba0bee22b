import { KINDS, isCircuit, type ItemKind } from './kinds';
import type { EditorItem } from './types';

const NAME = /^[A-Za-z][A-Za-z0-9_.-]*$/;

/** The next free name for a new element of this kind: R1, R2, … */
export function nextName(
	items: EditorItem[],
	kind: ItemKind,
	taken: Set<string> = new Set()
): string {
	if (!isCircuit(kind)) return kind === 'LABEL' ? nextLabel(items) : '';
	const used = new Set([...taken, ...items.filter((i) => isCircuit(i.kind)).map((i) => i.name)]);
	const prefix = KINDS[kind].prefix;
	let k = 1;
	while (used.has(`${prefix}${k}`)) k++;
	return `${prefix}${k}`;
}

function nextLabel(items: EditorItem[]): string {
	const used = new Set(items.filter((i) => i.kind === 'LABEL').map((i) => i.name));
	let k = 1;
	while (used.has(`net${k}`)) k++;
	return `net${k}`;
}

/** Why `name` cannot be the name of item `id`, or null when it can. */
export function nameProblem(items: EditorItem[], id: string, name: string): string | null {
	const item = items.find((i) => i.id === id);
	if (!item) return 'no such item';
	const n = name.trim();
	if (!n) return 'the name is empty';
	if (n.length > 64) return 'the name is longer than 64 characters';
	if (item.kind === 'LABEL') {
		return /\s/.test(n) ? 'a net name cannot contain spaces' : null;
	}
	if (!NAME.test(n)) return 'start with a letter; then letters, digits, _ . or -';
	if (n === 'gnd') return '"gnd" is the reference node';
	const clash = items.find((i) => i.id !== id && isCircuit(i.kind) && i.name === n);
	return clash ? `"${n}" is already the name of another element` : null;
}

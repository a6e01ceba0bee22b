// The editor's state: what is drawn, what is selected, and the undo history. Every change goes
// through `apply`, so every change is undoable and bumps `version` (which autosave and the live
// analysis watch). Arrays are replaced, never mutated, so snapshots are cheap and `$state.raw`
// keeps 200-element drawings fast. Sets and Maps here are scratch values inside one call, never
// reactive state, hence the lint rule below is off for this file.
/* eslint-disable svelte/prefer-svelte-reactivity */
import { getContext, setContext } from 'svelte';
import { snap, nextRotation } from './geometry';
import { History } from './history';
import { KINDS, hasValue, isCircuit, isSource, type ItemKind } from './kinds';
import { nameProblem, nextName } from './names';
import { computeNets, netNameProblem, pinAll } from './nets';
import { planJoin } from './join-net';
import { buildDocument } from './to-document';
import { terminalKey, type EditorItem, type Snapshot, type TerminalRef, type Wire } from './types';
import type { VariantSet } from '$lib/network/variant-schema';
import { dropElements, renameElement, setOptionValue } from './variant-edits';
import { activeVariant } from './variant-pick';

const uid = (p: string) => `${p}-${Math.random().toString(36).slice(2, 10)}`;

interface Clip {
	items: EditorItem[];
	wires: Wire[];
}

export class EditorState {
	title = $state('');
	items = $state.raw<EditorItem[]>([]);
	wires = $state.raw<Wire[]>([]);
	input = $state<string | null>(null);
	/** The sheet's variants (part of the drawing: saved, undone and redone with it). */
	variants = $state.raw<VariantSet | null>(null);
	/** Net names pinned on terminals (nets.ts): saved, undone and redone with the drawing. */
	netNames = $state.raw<Record<string, string>>({});
	/** The option picked in each variant group (a view choice, not part of the history). */
	pick = $state.raw<number[]>([]);
	selected = $state.raw<string[]>([]);
	selectedWires = $state.raw<string[]>([]);
	readonly = $state(false);
	/** Bumps on every content change (not on selection). */
	version = $state(0);
	#history = new History<Snapshot>();
	#historySize = $state({ past: 0, future: 0 });
	#clip: Clip | null = null;

	readonly built = $derived(buildDocument(this.snapshot));
	/** The picked variant: its name, choice and what it overrides (null without variants). */
	readonly variant = $derived(activeVariant(this.built.document, this.pick));
	readonly canUndo = $derived(this.#historySize.past > 0);
	readonly canRedo = $derived(this.#historySize.future > 0);

	get snapshot(): Snapshot {
		return {
			title: this.title,
			items: this.items,
			wires: this.wires,
			input: this.input,
			variants: this.variants,
			netNames: this.netNames
		};
	}

	get selectedItems(): EditorItem[] {
		const s = new Set(this.selected);
		return this.items.filter((i) => s.has(i.id));
	}

	/** Replace everything (opening a sheet, loading another revision). */
	load(s: Snapshot, { keepHistory = false } = {}): void {
		if (keepHistory) this.#history.push(this.snapshot);
		else this.#history.clear();
		this.#set(settleNames(s));
		this.selected = [];
		this.selectedWires = [];
	}

	#set(s: Snapshot): void {
		this.title = s.title;
		this.items = s.items;
		this.wires = s.wires;
		this.input = s.input;
		this.variants = s.variants ?? null;
		this.netNames = s.netNames ?? {};
		this.version++;
		this.#historySize = { past: this.#history.past.length, future: this.#history.future.length };
	}

	apply(next: Partial<Snapshot>, key?: string): void {
		if (this.readonly) return;
		this.#history.push(this.snapshot, key);
		const merged = { ...this.snapshot, ...next };
		// Nets keep their names through the change (new nets get theirs now, in the same step).
		this.#set(sameShape(this.snapshot, merged) ? merged : settleNames(merged));
	}

	/**
	 * Rename a net (one undo step): every terminal on it carries the new name; net-name marks on
	 * it follow. Returns the reason when the name is refused.
	 */
	renameNet(current: string, name: string): string | null {
		const nets = this.built.nets;
		const problem = netNameProblem(nets, current, name);
		if (problem) return problem;
		const n = name.trim();
		const net = nets.nets.find((x) => x.name === current);
		if (!net || net.grounded || n === current) return null;
		const on = new Set(net.terminals);
		const netNames = { ...this.netNames };
		for (const t of net.terminals) netNames[t] = n;
		const items = this.items.map((i) =>
			i.kind === 'LABEL' && on.has(`${i.id}:t`) ? { ...i, name: n } : i
		);
		this.apply({ netNames, items });
		return null;
	}

	undo(): void {
		const prev = this.readonly ? null : this.#history.undo(this.snapshot);
		if (!prev) return;
		this.#set(prev);
		this.#dropStaleSelection();
	}

	redo(): void {
		const next = this.readonly ? null : this.#history.redo(this.snapshot);
		if (!next) return;
		this.#set(next);
		this.#dropStaleSelection();
	}

	#dropStaleSelection(): void {
		const ids = new Set(this.items.map((i) => i.id));
		this.selected = this.selected.filter((id) => ids.has(id));
		const wids = new Set(this.wires.map((w) => w.id));
		this.selectedWires = this.selectedWires.filter((id) => wids.has(id));
	}

	select(items: string[], wires: string[] = []): void {
		this.selected = items;
		this.selectedWires = wires;
	}

	addItem(kind: ItemKind, x: number, y: number): string | null {
		if (kind === 'PROBE' && this.items.some((i) => i.kind === 'PROBE')) return null;
		const info = KINDS[kind];
		const item: EditorItem = {
			id: uid('it'),
			kind,
			name: nextName(this.items, kind),
			value: info.defaultValue ?? '',
			x: snap(x - info.width / 2),
			y: snap(y - info.height / 2),
			rotation: 0,
			flip: false
		};
		if (kind === 'CCCS' || kind === 'CCVS') {
			const v = this.items.find((i) => i.kind === 'V');
			if (v) item.control = v.name;
		}
		// The first source placed is taken as the input; people can change it.
		const input = this.input ?? (isSource(kind) ? item.id : null);
		this.apply({ items: [...this.items, item], input });
		this.select([item.id]);
		return item.id;
	}

	moveItems(positions: Map<string, { x: number; y: number }>): void {
		let changed = false;
		const items = this.items.map((i) => {
			const p = positions.get(i.id);
			if (!p || (p.x === i.x && p.y === i.y)) return i;
			changed = true;
			return { ...i, x: p.x, y: p.y };
		});
		if (changed) this.apply({ items });
	}

	updateItem(id: string, patch: Partial<EditorItem>, key?: string): void {
		this.apply({ items: this.items.map((i) => (i.id === id ? { ...i, ...patch } : i)) }, key);
	}

	/**
	 * Set several elements' values at once, by element name (the network id), as ONE undo step:
	 * the way in for tools beside the drawing (the design aids' "apply"). Values are text as a
	 * person would type it. Returns the names whose value changed; a name not on the sheet, a
	 * part without a value, or a part marked as a fixed value (a cable, a parasitic: not the
	 * designer's to change) is left alone.
	 */
	setValues(values: Record<string, string>): string[] {
		if (this.readonly) return [];
		// On a sheet with variants the values are those of the picked variant: a part whose value
		// an option of it sets gets that option's value changed; every other part (shared by the
		// variants) its drawn value — so snapping keeps shared parts shared.
		const set = this.variant?.overrides.values;
		let variants = this.variants;
		const changed: string[] = [];
		const items = this.items.map((i) => {
			if (!hasValue(i.kind) || i.role === 'fixed' || !Object.hasOwn(values, i.name)) return i;
			const value = values[i.name].trim();
			const own = set?.get(i.name);
			if (own) {
				if (value !== String(own.value).trim()) {
					variants = setOptionValue(
						variants,
						own.group,
						this.variant!.info.choice[own.group],
						i.name,
						value
					);
					changed.push(i.name);
				}
				return i;
			}
			if (value === i.value.trim()) return i;
			changed.push(i.name);
			return { ...i, value };
		});
		if (changed.length) this.apply({ items, variants });
		return changed;
	}

	/** Change the variant block as one undo step (the edits are in variant-edits.ts). */
	setVariants(next: VariantSet | null, key?: string): void {
		if (next === this.variants) return;
		this.apply({ variants: next }, key);
	}

	/** Pick an option of one variant group (which variant the canvas and results show). */
	pickOption(group: number, option: number): void {
		const next = [...this.pick];
		while (next.length <= group) next.push(0);
		next[group] = option;
		this.pick = next;
	}

	/** Returns the reason when the name is refused; controls that named the old one follow. */
	rename(id: string, name: string): string | null {
		const problem = nameProblem(this.items, id, name);
		if (problem) return problem;
		const old = this.items.find((i) => i.id === id)!;
		const n = name.trim();
		if (old.name === n) return null;
		const follows = old.kind === 'V';
		this.apply({
			items: this.items.map((i) =>
				i.id === id
					? { ...i, name: n }
					: follows && i.control === old.name
						? { ...i, control: n }
						: i
			),
			// Overrides are kept by part name: they follow the new one.
			variants: renameElement(this.variants, old.name, n)
		});
		return null;
	}

	#transformSelected(f: (i: EditorItem) => EditorItem): void {
		const s = new Set(this.selected);
		if (s.size === 0) return;
		this.apply({ items: this.items.map((i) => (s.has(i.id) ? f(i) : i)) });
	}

	rotateSelected(): void {
		this.#transformSelected((i) => ({ ...i, rotation: nextRotation(i.rotation) }));
	}

	flipSelected(): void {
		this.#transformSelected((i) => ({ ...i, flip: !i.flip }));
	}

	deleteSelected(): void {
		const s = new Set(this.selected);
		const sw = new Set(this.selectedWires);
		if (s.size === 0 && sw.size === 0) return;
		const gone = new Set(
			this.items.filter((i) => s.has(i.id) && isCircuit(i.kind)).map((i) => i.name)
		);
		this.apply({
			items: this.items.filter((i) => !s.has(i.id)),
			wires: this.wires.filter((w) => !sw.has(w.id) && !s.has(w.from.item) && !s.has(w.to.item)),
			input: this.input && s.has(this.input) ? null : this.input,
			// A deleted part's overrides go with it (a part in one position only is "absent", not deleted).
			...(gone.size ? { variants: dropElements(this.variants, gone) } : {})
		});
		this.select([]);
	}

	copy(): boolean {
		const s = new Set(this.selected);
		if (s.size === 0) return false;
		this.#clip = {
			items: this.items.filter((i) => s.has(i.id)),
			wires: this.wires.filter((w) => s.has(w.from.item) && s.has(w.to.item))
		};
		return true;
	}

	cut(): void {
		if (this.copy()) this.deleteSelected();
	}

	/** Paste the clipboard shifted by (dx, dy); new ids and free names; the copy is selected. */
	paste(dx = 40, dy = 40): void {
		const clip = this.#clip;
		if (!clip || this.readonly) return;
		const ids = new Map<string, string>();
		const taken = new Set<string>();
		const names = new Map<string, string>();
		const hasProbe = this.items.some((i) => i.kind === 'PROBE');
		const fresh: EditorItem[] = [];
		for (const i of clip.items) {
			if (i.kind === 'PROBE' && hasProbe) continue;
			const id = uid('it');
			ids.set(i.id, id);
			const name = isCircuit(i.kind) ? nextName(this.items, i.kind, taken) : i.name;
			taken.add(name);
			names.set(i.name, name);
			fresh.push({ ...i, id, name, x: i.x + dx, y: i.y + dy });
		}
		// A copied dependent source keeps following a copied control source.
		for (const f of fresh)
			if (
				f.control &&
				names.has(f.control) &&
				clip.items.some((c) => c.kind === 'V' && c.name === f.control)
			)
				f.control = names.get(f.control);
		const wires = clip.wires
			.filter((w) => ids.has(w.from.item) && ids.has(w.to.item))
			.map((w) => ({
				id: uid('w'),
				from: { ...w.from, item: ids.get(w.from.item)! },
				to: { ...w.to, item: ids.get(w.to.item)! }
			}));
		this.apply({ items: [...this.items, ...fresh], wires: [...this.wires, ...wires] });
		this.select(fresh.map((f) => f.id));
		this.#clip = { items: fresh, wires };
	}

	duplicateSelected(): void {
		const clip = this.#clip;
		if (this.copy()) this.paste();
		if (clip) this.#clip = clip;
	}

	connect(from: TerminalRef, to: TerminalRef): string | null {
		if (from.item === to.item && from.terminal === to.terminal) return null;
		const a = terminalKey(from);
		const b = terminalKey(to);
		const exists = this.wires.some((w) => {
			const x = terminalKey(w.from);
			const y = terminalKey(w.to);
			return (x === a && y === b) || (x === b && y === a);
		});
		if (exists) return null;
		const wire: Wire = { id: uid('w'), from, to };
		this.apply({ wires: [...this.wires, wire] });
		return wire.id;
	}

	/** Remove every wire on one terminal (the keyboard's way to delete wires); returns how many. */
	disconnect(at: TerminalRef): number {
		const k = terminalKey(at);
		const keep = this.wires.filter((w) => terminalKey(w.from) !== k && terminalKey(w.to) !== k);
		const removed = this.wires.length - keep.length;
		if (removed) this.apply({ wires: keep });
		return removed;
	}

	/**
	 * Join a terminal to the net called `name` (one undo step; see join-net.ts). Returns the
	 * reason when nothing was changed.
	 */
	joinNet(at: TerminalRef, name: string): { problem: string } | { added: string[] } {
		if (this.readonly) return { problem: 'the sheet is read-only' };
		const plan = planJoin(this.items, this.wires, at, name, uid);
		if (!plan.ok) return { problem: plan.problem };
		this.apply({ items: [...this.items, ...plan.items], wires: [...this.wires, ...plan.wires] });
		return { added: plan.items.map((i) => i.id) };
	}

	setInput(id: string): void {
		const item = this.items.find((i) => i.id === id);
		if (item && isSource(item.kind) && this.input !== id) this.apply({ input: id });
	}

	/** Point the output marker's terminal ('pos' or 'neg') at a net; places the marker if needed. */
	setOutputTerminal(which: 'pos' | 'neg', net: string): void {
		const nets = computeNets(this.items, this.wires, this.netNames);
		let items = this.items;
		let probe = items.find((i) => i.kind === 'PROBE');
		const target = nets.nets
			.find((n) => n.name === net)
			?.terminals.find((t) => !probe || !t.startsWith(`${probe.id}:`));
		const [tItem, tTerm] = target ? target.split(':') : [null, null];
		if (!probe) {
			const anchor = items.find((i) => i.id === tItem);
			probe = {
				id: uid('it'),
				kind: 'PROBE',
				name: '',
				value: '',
				x: snap((anchor?.x ?? 0) + 120),
				y: snap(anchor?.y ?? 0),
				rotation: 0,
				flip: false
			};
			items = [...items, probe];
		}
		const pid = probe.id;
		const mine = (r: TerminalRef) => r.item === pid && r.terminal === which;
		const wires = this.wires.filter((w) => !mine(w.from) && !mine(w.to));
		// Reference on gnd is the marker's unwired negative terminal; otherwise wire it.
		if (tItem && tTerm && !(which === 'neg' && net === 'gnd')) {
			wires.push({
				id: uid('w'),
				from: { item: pid, terminal: which },
				to: { item: tItem, terminal: tTerm }
			});
		}
		this.apply({ items, wires });
	}
}

/** Same parts and wires (only values, names or positions changed): net names cannot move. */
function sameShape(a: Snapshot, b: Snapshot): boolean {
	if (a.wires !== b.wires || a.netNames !== b.netNames || a.items.length !== b.items.length)
		return false;
	return a.items.every((x, i) => {
		const y = b.items[i];
		return x.id === y.id && x.kind === y.kind && (x.kind !== 'LABEL' || x.name === y.name);
	});
}

/** Pin every terminal on its net's current name (dropping pins of terminals that are gone). */
function settleNames(s: Snapshot): Snapshot {
	return { ...s, netNames: pinAll(computeNets(s.items, s.wires, s.netNames)) };
}

const KEY = Symbol('polewise-editor');
export const setEditorContext = (s: EditorState) => setContext(KEY, s);
export const getEditorContext = () => getContext<EditorState>(KEY);

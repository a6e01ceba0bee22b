// Drawing → network document. The document is what the solver and the sheets API see; anything
// that keeps it from being analysed is reported as a problem naming the item, and the analysis
// is not run while a problem stands (a half-typed value never reaches the solver).
import type { NetworkDocument, NetworkElement } from '$lib/network/schema';
import { KINDS, isCircuit, hasValue } from './kinds';
import { computeNets, GROUND_NET, type NetMap } from './nets';
import type { Snapshot, SheetLayout } from './types';
import { checkValue } from './values';
import { listVariants } from '$lib/network/variants';

export interface BuildProblem {
	/** Internal item id, when one item is at fault. */
	item?: string;
	message: string;
}

export interface Built {
	document: NetworkDocument;
	layout: SheetLayout;
	problems: BuildProblem[];
	nets: NetMap;
	/** network element id → item id, so solver errors and pole owners find their symbol. */
	itemByElement: Map<string, string>;
}

export function buildDocument(s: Snapshot): Built {
	const nets = computeNets(s.items, s.wires, s.netNames);
	const problems: BuildProblem[] = [];
	const elements: NetworkElement[] = [];
	const itemByElement = new Map<string, string>();
	const names = new Set<string>();
	for (const it of s.items) {
		if (!isCircuit(it.kind)) continue;
		if (names.has(it.name))
			problems.push({ item: it.id, message: `the name "${it.name}" is used twice` });
		names.add(it.name);
		itemByElement.set(it.name, it.id);
		const nodes = KINDS[it.kind].terminals.map((t) => nets.byTerminal.get(`${it.id}:${t.name}`)!);
		const el: NetworkElement = { id: it.name, type: it.kind, nodes };
		if (hasValue(it.kind)) {
			el.value = it.value.trim();
			const check = checkValue(it.kind, it.value);
			if (!check.ok) problems.push({ item: it.id, message: `${it.name}: ${check.message}` });
			if (it.role && it.role !== 'design') el.role = it.role;
			if (it.role === 'trimmer') {
				const range = it.range ?? { min: '', max: '' };
				el.range = { min: range.min.trim(), max: range.max.trim() };
				const lo = checkValue(it.kind, range.min);
				const hi = checkValue(it.kind, range.max);
				const bad = !lo.ok
					? `range min: ${lo.message}`
					: !hi.ok
						? `range max: ${hi.message}`
						: null;
				if (bad) problems.push({ item: it.id, message: `${it.name}: ${bad}` });
				else if (lo.ok && hi.ok && !(lo.value < hi.value))
					problems.push({
						item: it.id,
						message: `${it.name}: the trimmer's range min must be below its max`
					});
			}
		}
		if (it.kind === 'CCCS' || it.kind === 'CCVS') {
			if (it.control) el.control = it.control;
			else
				problems.push({
					item: it.id,
					message: `${it.name}: choose the voltage source whose current drives it`
				});
		}
		elements.push(el);
	}
	const inputItem = s.items.find((i) => i.id === s.input);
	if (elements.length > 0 && !inputItem) {
		problems.push({
			message: 'choose the input source (select a voltage or current source and mark it as input)'
		});
	}
	const probe = s.items.find((i) => i.kind === 'PROBE');
	let output: NetworkDocument['output'] = { node: GROUND_NET, reference: GROUND_NET };
	if (probe) {
		const pos = nets.byTerminal.get(`${probe.id}:pos`)!;
		const negKey = `${probe.id}:neg`;
		const negWired = s.wires.some((w) =>
			[w.from, w.to].some((r) => `${r.item}:${r.terminal}` === negKey)
		);
		const neg = negWired ? nets.byTerminal.get(negKey)! : GROUND_NET;
		const posWired = nets.nets.find((n) => n.name === pos)!.terminals.length > 1;
		if (!posWired)
			problems.push({ item: probe.id, message: 'wire the output marker to the node to observe' });
		output = { node: pos, reference: neg };
	} else if (elements.length > 0) {
		problems.push({ message: 'place the output marker on the node to observe' });
	}
	if (elements.length === 0)
		problems.push({ message: 'the sheet is empty: drag elements from the parts list' });
	const document: NetworkDocument = {
		schema: 1,
		...(s.title ? { title: s.title } : {}),
		elements,
		// An unfinished drawing is still saved (nothing is lost); the problem above keeps it from
		// being analysed, and the placeholder keeps the document within the format's shape.
		input: inputItem?.name ?? 'none',
		output,
		...(s.variants ? { variants: s.variants } : {})
	};
	if (s.variants) {
		try {
			listVariants(document);
		} catch (e) {
			problems.push({ message: `variants: ${(e as Error).message}` });
		}
	}
	const layout: SheetLayout = {
		format: 'polewise-canvas',
		version: 1,
		items: s.items,
		wires: s.wires,
		input: s.input,
		...(s.netNames && Object.keys(s.netNames).length ? { netNames: s.netNames } : {})
	};
	return { document, layout, problems, nets, itemByElement };
}

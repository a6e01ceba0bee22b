import { networkDocumentSchema, type ElementType } from '../network/schema';
import { baseNetwork, listVariants, VariantError } from '../network/variants';
import { SolverError } from './errors';
import { parseValue } from './parse-value';
import { checkTopology } from './topology';
import { fromZod, preflight } from './validate-shape';
import { GROUND, type ResolvedElement, type ResolvedNetwork, type Warning } from './types';

const NODE_COUNT: Record<ElementType, number> = {
	R: 2,
	C: 2,
	L: 2,
	V: 2,
	I: 2,
	CCCS: 2,
	CCVS: 2,
	VCCS: 4,
	VCVS: 4,
	OPAMP: 3
};
const UNIT: Record<ElementType, string | undefined> = {
	R: 'Ω',
	C: 'F',
	L: 'H',
	V: 'V',
	I: 'A',
	VCCS: 'S',
	CCVS: 'Ω',
	VCVS: undefined,
	CCCS: undefined,
	OPAMP: undefined
};

const isGround = (name: string) => name === 'gnd' || name === '0';

/**
 * The single front door: turns an untrusted document into a resolved network or throws the one
 * SolverError that names the first problem. Order matters for the message a person sees: shape,
 * then each element in document order, then references, then topology.
 */
export function validateNetwork(doc: unknown): ResolvedNetwork {
	preflight(doc);
	const parsed = networkDocumentSchema.safeParse(doc);
	if (!parsed.success) throw fromZod(doc, parsed.error.issues[0]);
	// A document with variants is its base network here (a variant is resolved before it comes
	// in); its variant block is still checked, so an import refuses a broken one.
	try {
		listVariants(parsed.data);
	} catch (e) {
		if (e instanceof VariantError)
			throw new SolverError('bad_variants', e.message, { element: e.where.element });
		throw e;
	}
	const d = baseNetwork(parsed.data);
	if (d.elements.length === 0)
		throw new SolverError('empty_network', 'the network has no elements');

	const warnings: Warning[] = [];
	const nodeIndex = new Map<string, number>();
	const nodeNames: string[] = [];
	const ids = new Map<string, number>();
	const node = (raw: string | number) => {
		const name = String(raw);
		if (isGround(name)) return GROUND;
		let i = nodeIndex.get(name);
		if (i === undefined) {
			i = nodeNames.length;
			nodeIndex.set(name, i);
			nodeNames.push(name);
		}
		return i;
	};

	const elements: ResolvedElement[] = d.elements.map((e, k) => {
		if (ids.has(e.id)) {
			throw new SolverError('duplicate_id', `element id "${e.id}" is used twice`, {
				element: e.id
			});
		}
		ids.set(e.id, k);
		const want = NODE_COUNT[e.type];
		if (e.nodes.length !== want) {
			throw new SolverError(
				'bad_nodes',
				`element "${e.id}": type ${e.type} needs ${want} nodes, got ${e.nodes.length}`,
				{ element: e.id }
			);
		}
		const nodes = e.nodes.map(node);
		if (want >= 2 && e.type !== 'OPAMP' && nodes[0] === nodes[1]) {
			throw new SolverError(
				'bad_nodes',
				`element "${e.id}": both terminals are on node "${String(e.nodes[0])}"`,
				{ element: e.id, node: String(e.nodes[0]) }
			);
		}
		if (e.type === 'OPAMP' && nodes[2] === GROUND) {
			throw new SolverError('bad_nodes', `element "${e.id}": the op-amp output is on gnd`, {
				element: e.id,
				node: 'gnd'
			});
		}
		return { id: e.id, type: e.type, nodes, value: readValue(e), control: -1 };
	});

	for (const [k, e] of elements.entries()) {
		if (e.type !== 'CCCS' && e.type !== 'CCVS') continue;
		const ctl = d.elements[k].control;
		const c = ctl === undefined ? undefined : ids.get(ctl);
		if (c === undefined || elements[c].type !== 'V') {
			const what = ctl === undefined ? 'has no "control"' : `control "${ctl}" is not a V element`;
			throw new SolverError('unknown_control', `element "${e.id}": ${what}`, { element: e.id });
		}
		e.control = c;
	}

	const input = ids.get(d.input);
	if (input === undefined || (elements[input].type !== 'V' && elements[input].type !== 'I')) {
		throw new SolverError(
			'bad_input',
			input === undefined
				? `input "${d.input}" is not an element of the network`
				: `input "${d.input}" is a ${elements[input].type}, not a V or I source`,
			{ element: d.input }
		);
	}
	const outNode = outputNode(String(d.output.node), nodeIndex);
	const refNode = outputNode(String(d.output.reference ?? 'gnd'), nodeIndex);
	if (outNode === refNode) {
		throw new SolverError('bad_nodes', `output node "${d.output.node}" is its own reference`, {
			node: String(d.output.node)
		});
	}

	for (const [k, e] of elements.entries()) {
		const trim = trimmerRange(d.elements[k], e.value);
		if (trim) warnings.push(trim);
	}
	for (const e of elements) {
		if ((e.type === 'R' || e.type === 'C' || e.type === 'L') && e.value < 0) {
			warnings.push({
				code: 'negative_value',
				message: `element "${e.id}" has a negative value (accepted, as in active models)`,
				element: e.id
			});
		}
	}
	const net: ResolvedNetwork = {
		title: d.title ?? '',
		elements,
		nodeNames,
		input,
		output: { node: outNode, reference: refNode },
		reactive: elements.flatMap((e, i) => (e.type === 'C' || e.type === 'L' ? [i] : [])),
		warnings
	};
	checkTopology(net);
	return net;
}

function readValue(
	e: { id: string; type: ElementType; value?: string | number },
	what = 'value'
): number {
	if (e.type === 'OPAMP') return 0;
	if (e.value === undefined) {
		throw new SolverError('bad_value', `element "${e.id}": ${what} is missing`, { element: e.id });
	}
	let v: number;
	try {
		v = parseValue(e.value, UNIT[e.type]);
	} catch (err) {
		if (!(err instanceof SolverError)) throw err;
		const where = what === 'value' ? '' : `${what}: `;
		throw new SolverError(err.code, `element "${e.id}": ${where}${err.message}`, {
			element: e.id
		});
	}
	if (v === 0 && (e.type === 'R' || e.type === 'C' || e.type === 'L')) {
		throw new SolverError(
			'zero_value',
			`element "${e.id}": a ${e.type} of ${what === 'value' ? 'value' : what} 0 is not allowed`,
			{ element: e.id }
		);
	}
	return v;
}

/**
 * A trimmer's range is read like its value; it must be a real interval. A nominal value outside
 * the range is analysed as given (the drawing may be mid-edit) with a warning that says so.
 */
function trimmerRange(
	e: {
		id: string;
		type: ElementType;
		role?: string;
		range?: { min: string | number; max: string | number };
	},
	value: number
): Warning | null {
	if (e.role !== 'trimmer') return null;
	if (e.type === 'OPAMP') {
		throw new SolverError('bad_value', `element "${e.id}": an op-amp cannot be a trimmer`, {
			element: e.id
		});
	}
	if (!e.range) {
		throw new SolverError(
			'bad_value',
			`element "${e.id}": a trimmer needs its range (min and max)`,
			{
				element: e.id
			}
		);
	}
	const min = readValue({ ...e, value: e.range.min }, 'range min');
	const max = readValue({ ...e, value: e.range.max }, 'range max');
	if (!(min < max)) {
		throw new SolverError(
			'bad_value',
			`element "${e.id}": the trimmer's range min must be below its max`,
			{ element: e.id }
		);
	}
	if (value < min || value > max) {
		return {
			code: 'outside_range',
			message: `element "${e.id}" is set outside its trimmer range`,
			element: e.id
		};
	}
	return null;
}

function outputNode(name: string, nodeIndex: Map<string, number>): number {
	if (isGround(name)) return GROUND;
	const i = nodeIndex.get(name);
	if (i === undefined) {
		throw new SolverError('unknown_output_node', `output node "${name}" is not in the network`, {
			node: name
		});
	}
	return i;
}

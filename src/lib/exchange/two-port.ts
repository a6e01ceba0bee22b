// The two-port between a chosen input port and output port (each a node pair) of a sheet's
// network. S-parameters come from the definition: terminate both ports in Z0, drive one port
// through Z0 from a source of EMF E and read the port voltages; with E = 1 the incident wave at
// the driven port makes S_kk = 2·V_k − 1 and S_jk = 2·V_j (V in volts per volt of E). That
// always exists for a network that can be solved with its ports terminated. Z and Y follow
// from S and exist only where (I − S) resp. (I + S) is invertible: a series element between
// the ports has no Z, a shunt element across them has no Y — we say so instead of writing
// numbers that mean nothing. Both ports may be the same node pair: that is how a single shunt
// element is described as a two-port.
import {
	networkDocumentSchema,
	type NetworkDocument,
	type NetworkElement
} from '../network/schema';
import { frequencyResponseAt, SolverError, validateNetwork } from '../solver';
import { add, type C, inv2, mul2, one, sub, scale, type M2 } from './complex2';

export interface PortPair {
	plus: string;
	minus: string;
}

export interface TwoPortRequest {
	document: unknown;
	port1: PortPair;
	port2: PortPair;
	z0: number;
	frequencies: number[];
}

export interface TwoPortResult {
	f: number[];
	z0: number;
	s: M2[];
}

export class TwoPortError extends Error {
	constructor(
		message: string,
		readonly details: { code?: string; element?: string; node?: string; frequency?: number } = {}
	) {
		super(message);
		this.name = 'TwoPortError';
	}
}

const isGround = (n: string) => n === 'gnd' || n === '0';
const PREFIX = 'pw-port';

/** The node names of a network a port may use (ground as "gnd"). */
export function portNodes(document: unknown): string[] {
	return ['gnd', ...validateNetwork(document).nodeNames];
}

/** Default ports: the input source's terminals and the output node pair. */
export function defaultPorts(document: unknown): { port1: PortPair; port2: PortPair } {
	const doc = networkDocumentSchema.parse(document);
	const input = doc.elements.find((e) => e.id === doc.input);
	const name = (n: string | number | undefined) =>
		n === undefined || isGround(String(n)) ? 'gnd' : String(n);
	return {
		port1: { plus: name(input?.nodes[0]), minus: name(input?.nodes[1]) },
		port2: { plus: name(doc.output.node), minus: name(doc.output.reference) }
	};
}

function checkPorts(document: unknown, r: TwoPortRequest) {
	const nodes = new Set(portNodes(document));
	for (const [label, p] of [
		['input port', r.port1],
		['output port', r.port2]
	] as const) {
		for (const n of [p.plus, p.minus]) {
			if (!nodes.has(isGround(n) ? 'gnd' : n))
				throw new TwoPortError(`${label}: node "${n}" is not a node of the network`, { node: n });
		}
		if ((isGround(p.plus) ? 'gnd' : p.plus) === (isGround(p.minus) ? 'gnd' : p.minus))
			throw new TwoPortError(`${label}: both terminals are on node "${p.plus}"`, { node: p.plus });
	}
	if (!(r.z0 > 0) || !Number.isFinite(r.z0))
		throw new TwoPortError('the reference impedance must be a positive number of ohms');
}

/**
 * The sheet's network with its input source taken out (the driven port stands in for it; other
 * independent sources are at zero as in every analysis) and both ports terminated in Z0.
 */
function terminated(
	doc: NetworkDocument,
	drive: PortPair,
	load: PortPair,
	z0: number,
	read: PortPair
): NetworkDocument {
	const controls = new Set(doc.elements.map((e) => e.control).filter(Boolean));
	const kept: NetworkElement[] = doc.elements
		.filter((e) => e.id !== doc.input || controls.has(e.id))
		.map((e) => (e.id === doc.input ? { ...e, type: 'V' as const, value: 0 } : e));
	const emf = `${PREFIX}-emf`;
	kept.push(
		{ id: `${PREFIX}-source`, type: 'V', nodes: [emf, drive.minus], value: 1 },
		{ id: `${PREFIX}-z0-drive`, type: 'R', nodes: [emf, drive.plus], value: z0 },
		{ id: `${PREFIX}-z0-load`, type: 'R', nodes: [load.plus, load.minus], value: z0 }
	);
	return {
		schema: 1,
		elements: kept,
		input: `${PREFIX}-source`,
		output: { node: read.plus, reference: read.minus }
	};
}

function solve(doc: NetworkDocument, f: number[]): C[] {
	try {
		return frequencyResponseAt(doc, f).h;
	} catch (e) {
		if (e instanceof SolverError) {
			const where = e.element?.startsWith(PREFIX) ? 'with both ports terminated in Z0, ' : '';
			throw new TwoPortError(`${where}${e.message}`, e.toJSON());
		}
		throw e;
	}
}

export function twoPort(r: TwoPortRequest): TwoPortResult {
	const parsed = networkDocumentSchema.safeParse(r.document);
	if (!parsed.success) {
		try {
			validateNetwork(r.document);
		} catch (e) {
			if (e instanceof SolverError) throw new TwoPortError(e.message, e.toJSON());
		}
		throw new TwoPortError('the network document is not valid');
	}
	try {
		checkPorts(r.document, r);
	} catch (e) {
		if (e instanceof SolverError) throw new TwoPortError(e.message, e.toJSON());
		throw e;
	}
	if (r.frequencies.some((f) => !(f > 0) || !Number.isFinite(f)))
		throw new TwoPortError('every frequency must be greater than 0 Hz');
	const doc = parsed.data;
	const { port1: p1, port2: p2, z0, frequencies: f } = r;
	// Drive port 1 (port 2 loaded), read both ports; then the other way round.
	const v11 = solve(terminated(doc, p1, p2, z0, p1), f);
	const v21 = solve(terminated(doc, p1, p2, z0, p2), f);
	const v12 = solve(terminated(doc, p2, p1, z0, p1), f);
	const v22 = solve(terminated(doc, p2, p1, z0, p2), f);
	const s = f.map((freq, i): M2 => {
		const m: M2 = [
			[sub(scale(v11[i], 2), one), scale(v12[i], 2)],
			[scale(v21[i], 2), sub(scale(v22[i], 2), one)]
		];
		for (const row of m)
			for (const c of row)
				if (!Number.isFinite(c.re) || !Number.isFinite(c.im))
					throw new TwoPortError(`the terminated network cannot be solved at ${freq} Hz`, {
						frequency: freq
					});
		return m;
	});
	return { f: f.slice(), z0, s };
}

/** Below this |det| the matrix is taken as singular (S entries of a passive port are ≤ 1). */
const SINGULAR = 1e-12;

export type Conversion =
	{ ok: true; values: M2[] } | { ok: false; message: string; frequency: number };

/** Z = Z0 (I + S)(I − S)⁻¹ — absent where (I − S) is singular (a series path between the ports). */
export function zFromS(t: TwoPortResult): Conversion {
	return convert(t, 'Z');
}

/** Y = (1/Z0)(I − S)(I + S)⁻¹ — absent where (I + S) is singular (a shunt path across the ports). */
export function yFromS(t: TwoPortResult): Conversion {
	return convert(t, 'Y');
}

function convert(t: TwoPortResult, kind: 'Z' | 'Y'): Conversion {
	const values: M2[] = [];
	for (let i = 0; i < t.f.length; i++) {
		const s = t.s[i];
		const iPlus: M2 = [
			[add(one, s[0][0]), s[0][1]],
			[s[1][0], add(one, s[1][1])]
		];
		const iMinus: M2 = [
			[sub(one, s[0][0]), scale(s[0][1], -1)],
			[scale(s[1][0], -1), sub(one, s[1][1])]
		];
		const [num, den] = kind === 'Z' ? [iPlus, iMinus] : [iMinus, iPlus];
		const inverse = inv2(den, SINGULAR);
		if (!inverse) {
			const why =
				kind === 'Z'
					? 'an element in series between the ports (no open-circuit description)'
					: 'an element across the ports (no short-circuit description)';
			return {
				ok: false,
				frequency: t.f[i],
				message: `${kind}-parameters do not exist for this two-port at ${t.f[i]} Hz: I ${kind === 'Z' ? '−' : '+'} S is singular there, as with ${why}`
			};
		}
		const k = kind === 'Z' ? t.z0 : 1 / t.z0;
		values.push(mul2(num, inverse).map((row) => row.map((c) => scale(c, k))) as M2);
	}
	return { ok: true, values };
}

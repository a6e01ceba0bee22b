import type { ElementType } from '../network/schema';

export type { ElementType };

/** Ground is node index -1 everywhere downstream; other nodes are 0..nodes.length-1. */
export const GROUND = -1;

export interface ResolvedElement {
	id: string;
	type: ElementType;
	/** Node indices in the order the format defines for the type (GROUND for gnd). */
	nodes: number[];
	/** SI base units; for OPAMP unused (0). For the input source it is the stated value. */
	value: number;
	/** Index into `elements` of the controlling V element (CCCS/CCVS), else -1. */
	control: number;
}

export interface Warning {
	code: string;
	message: string;
	element?: string;
	node?: string;
}

/** What the front door hands to every step: fully resolved, no optional fields. */
export interface ResolvedNetwork {
	title: string;
	elements: ResolvedElement[];
	nodeNames: string[];
	input: number;
	output: { node: number; reference: number };
	/** Indices of C and L elements in document order: the reactive ports. */
	reactive: number[];
	warnings: Warning[];
}

export interface Complex {
	re: number;
	im: number;
}

export interface Singularity {
	/** rad/s */
	re: number;
	im: number;
	/** |s| / 2π */
	hz: number;
	/** |s| / (−2 re); null for a pole or zero at the origin or on the jω axis. */
	q: number | null;
	/** −re / |s|; null at the origin. */
	zeta: number | null;
	/** −1 / re; null where re = 0. */
	tau: number | null;
}

export interface PoleInfo extends Singularity {
	estimate: { element: string; tau: number | null; re: number | null; hz: number | null } | null;
	/** |estimate − pole| / |pole| (real estimate against the complex pole). */
	relativeError: number | null;
	owners: { element: string; share: number }[];
	/** Index into `zeros` of a zero closer than 1 %, or null. */
	cancelledBy: number | null;
}

export interface TimeConstant {
	element: string;
	resistance: number | null;
	tau: number | null;
}

export interface ExpansionTerm {
	elements: string[];
	value: number;
}

export interface ExpansionCoefficient {
	order: number;
	/** The coefficient as computed from the exact poles/zeros (always present when finite). */
	value: number;
	/** Sum of the listed terms family (null when the terms were not enumerated). */
	termSum: number | null;
	termCount: number;
	/** Largest terms by magnitude (at most 12). */
	terms: ExpansionTerm[];
}

export interface Analysis {
	title: string;
	poles: PoleInfo[];
	zeros: (Singularity & { cancels: number | null })[];
	pairs: { pole: number; zero: number; distance: number }[];
	dcGain: number | null;
	highFrequencyGain: number | null;
	timeConstants: {
		openCircuit: TimeConstant[];
		shortCircuit: TimeConstant[];
		sequential: { element: string; tau: number | null }[];
	};
	portMatrices: {
		ports: string[];
		kinds: ('C' | 'L')[];
		R: (number | null)[][];
		C: number[][];
	};
	expansion: {
		denominator: ExpansionCoefficient[];
		numerator: ExpansionCoefficient[];
		dominantPairs: { elements: [string, string]; value: number; fraction: number }[];
	} | null;
	frequencyResponse: {
		f: number[];
		magnitudeDb: (number | null)[];
		phaseDeg: (number | null)[];
		groupDelay: (number | null)[];
	} | null;
	bandwidth: number | null;
	step: {
		t: number[];
		y: number[];
		riseTime: number | null;
		overshoot: number | null;
		settlingTime: number | null;
		final: number | null;
	} | null;
	inputImpedance: {
		dc: Complex | null;
		f: number[];
		magnitude: (number | null)[];
		phaseDeg: (number | null)[];
	} | null;
	warnings: Warning[];
	meta: { elements: number; nodes: number; reactive: number; ms: number };
}

export interface AnalyzeOptions {
	frequency?: { points?: number; fMin?: number; fMax?: number } | false;
	step?: { points?: number; tEnd?: number } | false;
	/** false: skip the time-and-transfer-constant expansion (reported as null). */
	expansion?: false;
	/** false: skip the input-impedance curve (the DC value is still computed; arrays empty). */
	impedanceCurve?: false;
}

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
	/** |s| / (−2 re) for a complex pair; null for a real root (Q belongs to a pair) and on the jω axis. */
	q: number | null;
	/** −re / |s| for a complex pair; null for a real root. */
	zeta: number | null;
	/** |s| in rad/s for a complex pair (its undamped natural frequency); null for a real root. */
	omega0: number | null;
	/** −1 / re; null where re = 0. */
	tau: number | null;
}

/**
 * A quick estimate of one exact pole (docs/methods.md, "Estimates of each pole"):
 * - `b1`: the dominant pole as −1/b1, b1 = Σ τ open;
 * - `ratio`: the k-th pole as −b(k−1)/b(k), ratios of successive denominator coefficients;
 * - `two-pole`: a root of 1 + b1·s + b2·s² (the denominator cut after s²);
 * - `sequential`: −1/τ of the k-th port the largest-first sequence chose.
 */
export type EstimateMethod = 'b1' | 'ratio' | 'two-pole' | 'sequential';

export interface PoleEstimate {
	method: EstimateMethod;
	/** What it is computed from, for people: "1/b1", "b1/b2", "1 + b1·s + b2·s²", "port Ctop". */
	basis: string;
	/** The port the sequential estimate names; null for the coefficient methods. */
	element: string | null;
	/** Estimated pole, rad/s (im ≠ 0 only for a two-pole estimate of a complex pair). */
	re: number;
	im: number;
	hz: number;
	/** −1/re for a real estimate, else null. */
	tau: number | null;
	/** |estimate − pole| / |pole|. */
	relativeError: number;
}

export interface PoleInfo extends Singularity {
	/** The headline estimate: the simplest within 2 % of the pole, else the closest; null when none exists. */
	estimate: PoleEstimate | null;
	/** Every estimate there is for this pole, headline first, then by error. */
	estimates: PoleEstimate[];
	/** The headline estimate's relative error (null without an estimate). */
	relativeError: number | null;
	owners: { element: string; share: number }[];
	/** Index into `zeros` of a zero closer than 1 %, or null. */
	cancelledBy: number | null;
	/** Sparse path: the residue of the transfer at this pole (rad/s units of the transfer). */
	residue?: Complex | null;
	/** Sparse path: normwise backward error ‖(G + pC)v‖ / ((‖G‖ + |p|‖C‖)‖v‖) of the pole's mode. */
	backwardError?: number;
}

/** One port's reading in a DC configuration, as the time-constant steps compute it. */
export interface PortReading {
	/** The port: a lone element's id, or its members' ids joined by " + " (docs/network-format.md). */
	element: string;
	resistance: number | null;
	tau: number | null;
}

/**
 * How the resistance a port sees is made up (resistance-formulas.ts): a series–parallel formula
 * of element names and its value; or why there is none — no DC path (`open`, value null = ∞),
 * shorted terminals (`short`, value 0), a bridge or a controlled source (`not-series-parallel`,
 * value from the solver and the resistors that matter most); `not-computed` above 200 ports or
 * 80 000 port × resistor pairs (value from the solver).
 */
export interface ResistanceFormula {
	kind: 'series-parallel' | 'open' | 'short' | 'not-series-parallel' | 'not-computed';
	/** "Rtop ∥ (Rsrc + Radc)"; null unless series–parallel. */
	formula: string | null;
	/** Ohms; null where infinite or unknown. */
	value: number | null;
	/** Why there is no formula; null when there is one. */
	reason: string | null;
	/** Not series–parallel: the resistors with the largest normalized sensitivity (∂R/∂r)(r/R), at most 3. */
	influence: { element: string; sensitivity: number }[];
}

/**
 * A pole and a zero closer than the doublet ratio (doublets.ts). The step response then carries
 * a slow tail: y(t) ≈ final·(1 + tail·e^(−t/tailTau)) after the fast part (tail > 0: it overshoots
 * and sags back; < 0: it undershoots and creeps up).
 */
export interface Doublet {
	/** Indices into `poles` and `zeros` (a complex pair is listed once, by its upper member). */
	pole: number;
	zero: number;
	/** (z − p)/p for real roots, |z − p|/|p| for complex ones. */
	separation: number;
	/** The doublet pole's share of the final value in the step response; null for complex pairs or without a finite DC gain. */
	tail: number | null;
	/** −1/Re p, s. */
	tailTau: number | null;
	/** Single-element changes that make pole and zero coincide, the suggested one first (at most 3). */
	closing: { element: string; from: number; to: number; change: number }[];
	/** Why `closing` is empty, when it is. */
	closingNote: string | null;
}

export interface TimeConstant extends PortReading {
	/** Element ids of the port, document order. */
	members: string[];
	/** Total capacitance or inductance of the port (SI units). */
	value: number;
	/** The resistance seen, as a formula of element names (or why not). */
	formula: ResistanceFormula;
}

export interface SequentialStep {
	element: string;
	members: string[];
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
	/** Pole–zero doublets closer than the doublet ratio (default 10 %). */
	doublets: Doublet[];
	dcGain: number | null;
	highFrequencyGain: number | null;
	timeConstants: {
		openCircuit: TimeConstant[];
		shortCircuit: TimeConstant[];
		sequential: SequentialStep[];
		/** Elmore delay to the output of an RC tree (Elmore 1948); absent or null otherwise. */
		elmore?: { node: string; delay: number } | null;
	};
	portMatrices: {
		ports: string[];
		/** Element ids of each port. */
		members: string[][];
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
		/** When the poles span more than two decades: samples evenly spaced in log t, for a log time axis. */
		logSpaced?: { t: number[]; y: number[] };
	} | null;
	inputImpedance: {
		dc: Complex | null;
		f: number[];
		magnitude: (number | null)[];
		phaseDeg: (number | null)[];
	} | null;
	warnings: Warning[];
	/**
	 * Which poles the answer holds: every one (the dense back end) or the k nearest a shift (the
	 * sparse back end, docs/methods.md "Large networks"); `total` is the network's number of
	 * finite poles by structure (null where controlled sources make it unknowable by structure).
	 */
	poleSet?: {
		method: 'all' | 'lanczos' | 'arnoldi';
		total: number | null;
		computed: number;
		/** The shift the computed poles are nearest to, rad/s (0: the slowest). */
		shift: number | null;
	};
	meta: {
		elements: number;
		nodes: number;
		reactive: number;
		ms: number;
		/** dense: every pole and zero; sparse: the large-network path (only k poles, no zeros). */
		backend?: 'dense' | 'sparse';
	};
}

export interface AnalyzeOptions {
	frequency?: { points?: number; fMin?: number; fMax?: number } | false;
	step?: { points?: number; tEnd?: number } | false;
	/** false: skip the time-and-transfer-constant expansion (reported as null). */
	expansion?: false;
	/** false: skip the input-impedance curve (the DC value is still computed; arrays empty). */
	impedanceCurve?: false;
	/** A pole and a zero closer than this fraction of the pole's magnitude are a doublet (default 0.1). */
	doubletRatio?: number;
	/**
	 * The back end: 'auto' (default) takes the sparse path above SPARSE_ABOVE reactive elements
	 * (analyze.ts); 'dense' and 'sparse' force one (both answer the same questions on the
	 * overlap, to 1e-9).
	 */
	backend?: 'auto' | 'dense' | 'sparse';
	/** Sparse path: how many poles (default 10) nearest which real shift (default 0: the slowest). */
	dominant?: { count?: number; near?: number };
	/** Sparse path: called with the share done (0…1) and the stage, for progress bars. */
	onProgress?: (done: number, stage: string) => void;
}

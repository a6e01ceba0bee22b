// The catalogue of what can sit on the canvas. Circuit kinds map 1:1 to network element types;
// the three marks (ground, net name, output marker) only shape the nets and the output.
import type { ElementType } from '$lib/network/schema';

export type MarkKind = 'GND' | 'LABEL' | 'PROBE';
export type ItemKind = ElementType | MarkKind;

export interface Terminal {
	/** Stable name inside the item, in the network format's node order for circuit kinds. */
	name: string;
	/** Position in the unrotated symbol box, in canvas units (multiples of the grid). */
	x: number;
	y: number;
	/** Short label for people (e.g. "+", "−", "ctrl +"). */
	label: string;
}

export interface KindInfo {
	kind: ItemKind;
	/** What the palette and the properties panel call it. */
	title: string;
	/** Name prefix for new elements: R1, C2, … */
	prefix: string;
	width: number;
	height: number;
	terminals: Terminal[];
	/** Unit the value is read in (network format); undefined for dimensionless gains. */
	unit?: string;
	/** What the value means, for the properties panel. */
	valueLabel?: string;
	defaultValue?: string;
	circuit: boolean;
}

export const GRID = 20;

const two = (a: string, b: string, w: number, h: number, vertical: boolean): Terminal[] =>
	vertical
		? [
				{ name: a, x: w / 2, y: 0, label: '+' },
				{ name: b, x: w / 2, y: h, label: '−' }
			]
		: [
				{ name: a, x: 0, y: h / 2, label: '1' },
				{ name: b, x: w, y: h / 2, label: '2' }
			];

const fourPort: Terminal[] = [
	{ name: 'p', x: 60, y: 0, label: 'out +' },
	{ name: 'n', x: 60, y: 80, label: 'out −' },
	{ name: 'cp', x: 0, y: 20, label: 'sense +' },
	{ name: 'cn', x: 0, y: 60, label: 'sense −' }
];

export const KINDS: Record<ItemKind, KindInfo> = {
	R: {
		kind: 'R',
		title: 'Resistor',
		prefix: 'R',
		width: 80,
		height: 40,
		terminals: two('a', 'b', 80, 40, false),
		unit: 'Ω',
		valueLabel: 'Resistance',
		defaultValue: '1k',
		circuit: true
	},
	C: {
		kind: 'C',
		title: 'Capacitor',
		prefix: 'C',
		width: 80,
		height: 40,
		terminals: two('a', 'b', 80, 40, false),
		unit: 'F',
		valueLabel: 'Capacitance',
		defaultValue: '10p',
		circuit: true
	},
	L: {
		kind: 'L',
		title: 'Inductor',
		prefix: 'L',
		width: 80,
		height: 40,
		terminals: two('a', 'b', 80, 40, false),
		unit: 'H',
		valueLabel: 'Inductance',
		defaultValue: '1µ',
		circuit: true
	},
	V: {
		kind: 'V',
		title: 'Voltage source',
		prefix: 'V',
		width: 40,
		height: 80,
		terminals: two('p', 'n', 40, 80, true),
		unit: 'V',
		valueLabel: 'Amplitude',
		defaultValue: '1',
		circuit: true
	},
	I: {
		kind: 'I',
		title: 'Current source',
		prefix: 'I',
		width: 40,
		height: 80,
		terminals: two('p', 'n', 40, 80, true),
		unit: 'A',
		valueLabel: 'Amplitude',
		defaultValue: '1µ',
		circuit: true
	},
	VCCS: {
		kind: 'VCCS',
		title: 'Voltage-driven current source',
		prefix: 'G',
		width: 80,
		height: 80,
		terminals: fourPort,
		unit: 'S',
		valueLabel: 'Transconductance gm',
		defaultValue: '1m',
		circuit: true
	},
	VCVS: {
		kind: 'VCVS',
		title: 'Voltage-driven voltage source',
		prefix: 'E',
		width: 80,
		height: 80,
		terminals: fourPort,
		valueLabel: 'Voltage gain',
		defaultValue: '10',
		circuit: true
	},
	CCCS: {
		kind: 'CCCS',
		title: 'Current-driven current source',
		prefix: 'F',
		width: 40,
		height: 80,
		terminals: two('p', 'n', 40, 80, true),
		valueLabel: 'Current gain β',
		defaultValue: '100',
		circuit: true
	},
	CCVS: {
		kind: 'CCVS',
		title: 'Current-driven voltage source',
		prefix: 'H',
		width: 40,
		height: 80,
		terminals: two('p', 'n', 40, 80, true),
		unit: 'Ω',
		valueLabel: 'Transresistance',
		defaultValue: '1k',
		circuit: true
	},
	OPAMP: {
		kind: 'OPAMP',
		title: 'Ideal op-amp',
		prefix: 'U',
		width: 80,
		height: 80,
		circuit: true,
		terminals: [
			{ name: 'plus', x: 0, y: 60, label: '+ in' },
			{ name: 'minus', x: 0, y: 20, label: '− in' },
			{ name: 'out', x: 80, y: 40, label: 'out' }
		]
	},
	GND: {
		kind: 'GND',
		title: 'Ground',
		prefix: 'gnd',
		width: 40,
		height: 40,
		terminals: [{ name: 'g', x: 20, y: 0, label: 'gnd' }],
		circuit: false
	},
	LABEL: {
		kind: 'LABEL',
		title: 'Net name',
		prefix: 'net',
		width: 80,
		height: 40,
		terminals: [{ name: 't', x: 0, y: 20, label: 'net' }],
		circuit: false
	},
	PROBE: {
		kind: 'PROBE',
		title: 'Output marker',
		prefix: 'out',
		width: 60,
		height: 80,
		circuit: false,
		terminals: [
			{ name: 'pos', x: 0, y: 20, label: 'output' },
			{ name: 'neg', x: 0, y: 60, label: 'reference' }
		]
	}
};

export const PALETTE_GROUPS: { title: string; kinds: ItemKind[] }[] = [
	{ title: 'Passive', kinds: ['R', 'C', 'L'] },
	{ title: 'Sources', kinds: ['V', 'I'] },
	{ title: 'Controlled', kinds: ['VCCS', 'VCVS', 'CCCS', 'CCVS', 'OPAMP'] },
	{ title: 'Nets', kinds: ['GND', 'LABEL', 'PROBE'] }
];

export const isSource = (k: ItemKind) => k === 'V' || k === 'I';
export const isCircuit = (k: ItemKind): k is ElementType => KINDS[k].circuit;
export const hasValue = (k: ItemKind) => isCircuit(k) && k !== 'OPAMP';

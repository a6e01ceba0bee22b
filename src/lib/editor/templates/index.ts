// Starting points for a new sheet. Values are our own, picked to show one idea each; the
// drawing is made by the automatic layout when the sheet first opens.
import type { NetworkDocument } from '$lib/network/schema';

export interface SheetTemplate {
	id: string;
	title: string;
	description: string;
	document: NetworkDocument;
}

const doc = (
	title: string,
	elements: NetworkDocument['elements'],
	input: string,
	node: string
): NetworkDocument => ({
	schema: 1,
	title,
	elements,
	input,
	output: { node, reference: 'gnd' }
});

export const TEMPLATES: SheetTemplate[] = [
	{
		id: 'empty',
		title: 'Empty sheet',
		description: 'Nothing drawn yet.',
		document: {
			schema: 1,
			title: '',
			elements: [],
			input: 'V1',
			output: { node: 'gnd', reference: 'gnd' }
		}
	},
	{
		id: 'compensated-divider',
		title: 'Compensated divider, 10:1',
		description:
			'Two RC arms with equal time constants (99 µs): the pole and zero cancel and a step passes flat.',
		document: doc(
			'Compensated divider, 10:1',
			[
				{ id: 'Vin', type: 'V', nodes: ['src', 'gnd'], value: 1 },
				{ id: 'Rs', type: 'R', nodes: ['src', 'top'], value: '50' },
				{ id: 'Rtop', type: 'R', nodes: ['top', 'out'], value: '9M' },
				{ id: 'Ctop', type: 'C', nodes: ['top', 'out'], value: '11p' },
				{ id: 'Rbot', type: 'R', nodes: ['out', 'gnd'], value: '1M' },
				{ id: 'Cbot', type: 'C', nodes: ['out', 'gnd'], value: '99p' }
			],
			'Vin',
			'out'
		)
	},
	{
		id: 'rc-low-pass',
		title: 'RC low-pass',
		description: 'One pole at 1/(2πRC) ≈ 9.9 kHz.',
		document: doc(
			'RC low-pass',
			[
				{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
				{ id: 'R1', type: 'R', nodes: ['in', 'out'], value: '1.6k' },
				{ id: 'C1', type: 'C', nodes: ['out', 'gnd'], value: '10n' }
			],
			'Vin',
			'out'
		)
	},
	{
		id: 'transistor-stage',
		title: 'Transistor stage (hybrid-π)',
		description:
			'Common-emitter small-signal model: rπ, Cπ, Cμ and gm into a loaded collector; Cμ shows the Miller effect.',
		document: doc(
			'Common-emitter stage, hybrid-π',
			[
				{ id: 'Vs', type: 'V', nodes: ['s', 'gnd'], value: 1 },
				{ id: 'Rs', type: 'R', nodes: ['s', 'b'], value: '600' },
				{ id: 'Rpi', type: 'R', nodes: ['b', 'gnd'], value: '2.5k' },
				{ id: 'Cpi', type: 'C', nodes: ['b', 'gnd'], value: '12p' },
				{ id: 'Cmu', type: 'C', nodes: ['b', 'c'], value: '2p' },
				{ id: 'Gm', type: 'VCCS', nodes: ['c', 'gnd', 'b', 'gnd'], value: '40m' },
				{ id: 'RL', type: 'R', nodes: ['c', 'gnd'], value: '4.7k' },
				{ id: 'CL', type: 'C', nodes: ['c', 'gnd'], value: '5p' }
			],
			'Vs',
			'c'
		)
	},
	{
		id: 'transimpedance-stage',
		title: 'Transimpedance stage',
		description:
			'A photocurrent into an ideal op-amp with 47 kΩ ∥ 1 pF feedback, then a small output RC.',
		document: doc(
			'Transimpedance stage, 47 kΩ',
			[
				{ id: 'Iph', type: 'I', nodes: ['inv', 'gnd'], value: '1µ' },
				{ id: 'Rsh', type: 'R', nodes: ['inv', 'gnd'], value: '50M' },
				{ id: 'Rf', type: 'R', nodes: ['inv', 'amp'], value: '47k' },
				{ id: 'Cf', type: 'C', nodes: ['inv', 'amp'], value: '1p' },
				{ id: 'U1', type: 'OPAMP', nodes: ['gnd', 'inv', 'amp'] },
				{ id: 'Ro', type: 'R', nodes: ['amp', 'out'], value: '100' },
				{ id: 'Co', type: 'C', nodes: ['out', 'gnd'], value: '470p' }
			],
			'Iph',
			'out'
		)
	},
	{
		id: 'sallen-key',
		title: 'Sallen–Key low-pass',
		description: 'Unity-gain second-order low-pass near 10.7 kHz with Q ≈ 0.74.',
		document: doc(
			'Sallen–Key low-pass, unity gain',
			[
				{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
				{ id: 'R1', type: 'R', nodes: ['in', 'mid'], value: '10k' },
				{ id: 'R2', type: 'R', nodes: ['mid', 'plus'], value: '10k' },
				{ id: 'C1', type: 'C', nodes: ['mid', 'out'], value: '2.2n' },
				{ id: 'C2', type: 'C', nodes: ['plus', 'gnd'], value: '1n' },
				{ id: 'U1', type: 'OPAMP', nodes: ['plus', 'out', 'out'] }
			],
			'Vin',
			'out'
		)
	}
];

export const templateById = (id: string | null | undefined): SheetTemplate | undefined =>
	TEMPLATES.find((t) => t.id === id);

import type { DesignSettings } from '../../../network/design-schema';

// Demo designs of the invented "Kestrel Ridge Instruments" lab. Values are our own, chosen to
// show what Polewise explains; none is copied from a product or a publication.

/** A 10:1 divider in front of a 1 MΩ ∥ 18 pF digitizer input, with 42 pF of cable and stray
 * capacitance; the top capacitor is a little under the exact compensation value (6.67 pF). */
export const digitizerDivider = {
	schema: 1,
	title: 'Digitizer input divider, 10:1',
	elements: [
		{ id: 'Vsig', type: 'V', nodes: ['src', 'gnd'], value: 1 },
		{ id: 'Rsrc', type: 'R', nodes: ['src', 'tip'], value: '50' },
		{ id: 'Rtop', type: 'R', nodes: ['tip', 'adc'], value: '9M' },
		{ id: 'Ctop', type: 'C', nodes: ['tip', 'adc'], value: '6.8p' },
		// The cable is given, not chosen: a fixed value the design aids leave alone.
		{ id: 'Ccable', type: 'C', nodes: ['adc', 'gnd'], value: '42p', role: 'fixed' as const },
		{ id: 'Radc', type: 'R', nodes: ['adc', 'gnd'], value: '1M' },
		{ id: 'Cadc', type: 'C', nodes: ['adc', 'gnd'], value: '18p' }
	],
	input: 'Vsig',
	output: { node: 'adc', reference: 'gnd' }
};

/**
 * The same divider as the lab's switchable digitizer input: three range positions and two cable
 * options, six variants of one sheet. Every position presents 10 MΩ (Rtop plus the shunt) and —
 * once compensated — the same input capacitance (about 6 pF); the 100:1 and 1000:1 positions put
 * in a shunt pair (Rsh, Csh) that 10:1 does without. Each position's top capacitor is a little
 * off its compensation value (6.06 pF at 100:1, 6.01 pF at 1000:1), so solving per position has
 * something to do; the longer cable adds 28 pF on the shunt side and upsets 10:1 most.
 * Attenuation steps 1 : 10 : 100 come from the resistors alone (1M ∥ Rsh against Rtop).
 */
export const digitizerDividerRanges = {
	...digitizerDivider,
	title: 'Digitizer input divider, three ranges',
	elements: [
		...digitizerDivider.elements,
		{ id: 'Rsh', type: 'R', nodes: ['adc', 'gnd'], value: '111.1k' },
		{ id: 'Csh', type: 'C', nodes: ['adc', 'gnd'], value: '540p' }
	],
	variants: {
		absent: ['Rsh', 'Csh'],
		groups: [
			{
				name: 'Range',
				options: [
					{ name: '10:1' },
					{ name: '100:1', values: { Rtop: '9.9M', Ctop: '6.2p' }, present: ['Rsh', 'Csh'] },
					{
						name: '1000:1',
						values: { Rtop: '9.99M', Ctop: '5.6p', Rsh: '10.1k', Csh: '5940p' },
						present: ['Rsh', 'Csh']
					}
				]
			},
			{
				name: 'Cable',
				options: [{ name: '1.2 m cable' }, { name: '2 m cable', values: { Ccable: '70p' } }]
			}
		]
	}
};

/** A photodiode transimpedance stage, 100 kΩ with 1.5 pF feedback, on an amplifier modelled
 * with one pole (open-loop gain 1e5, gain-bandwidth about 10 MHz) so its closing is visible. */
export const photodiodeTia = {
	schema: 1,
	title: 'Photodiode transimpedance stage, 100 kΩ',
	elements: [
		{ id: 'Iph', type: 'I', nodes: ['inv', 'gnd'], value: 1e-6 },
		{ id: 'Cpd', type: 'C', nodes: ['inv', 'gnd'], value: '12p' },
		{ id: 'Rf', type: 'R', nodes: ['inv', 'out'], value: '100k' },
		{ id: 'Cf', type: 'C', nodes: ['inv', 'out'], value: '1.5p' },
		{ id: 'Gm', type: 'VCCS', nodes: ['gnd', 'int', 'gnd', 'inv'], value: '1m' },
		{ id: 'Ro', type: 'R', nodes: ['int', 'gnd'], value: '100M' },
		{ id: 'Cc', type: 'C', nodes: ['int', 'gnd'], value: '15.9p' },
		{ id: 'Buf', type: 'VCVS', nodes: ['out', 'gnd', 'int', 'gnd'], value: 1 }
	],
	input: 'Iph',
	output: { node: 'out', reference: 'gnd' }
};

/** A unity-gain second-order low-pass in front of a converter: corner near 100 kHz, Q ≈ 0.71. */
export const antiAliasFilter = {
	schema: 1,
	title: 'Anti-alias filter, 2nd order, 100 kHz',
	elements: [
		{ id: 'Vin', type: 'V', nodes: ['in', 'gnd'], value: 1 },
		{ id: 'R1', type: 'R', nodes: ['in', 'mid'], value: '11k' },
		{ id: 'R2', type: 'R', nodes: ['mid', 'plus'], value: '11k' },
		{ id: 'C1', type: 'C', nodes: ['mid', 'out'], value: '200p' },
		{ id: 'C2', type: 'C', nodes: ['plus', 'gnd'], value: '100p' },
		{ id: 'U1', type: 'OPAMP', nodes: ['plus', 'out', 'out'] }
	],
	input: 'Vin',
	output: { node: 'out', reference: 'gnd' }
};

/**
 * The divider's spec: its limits (every variant) and the specs across its variants — 10 MΩ in
 * every position and cable, attenuation steps of 1 : 10 : 100, and the same input capacitance
 * in every range position (per cable). As seeded, the positions are not yet compensated, so the
 * last one fails until each position's Ctop is solved.
 */
export const dividerSettings: DesignSettings = {
	spec: { bandwidthMin: 20e6, inputResistanceMin: 9e6 },
	across: [
		{ kind: 'equal', figure: 'inputResistance', tolerance: 0.001 },
		{
			kind: 'ratio',
			figure: 'attenuation',
			group: 'Range',
			ratios: { '10:1': 1, '100:1': 10, '1000:1': 100 },
			tolerance: 0.005
		},
		{ kind: 'equal', figure: 'inputCapacitance', group: 'Range', tolerance: 0.05 }
	],
	tolerances: { elements: [], runs: 1000, seed: 1 }
};

export const demoSheets: {
	name: string;
	document: { elements: { id: string; type: string; value?: string | number }[] };
	settings?: DesignSettings;
}[] = [
	{ name: 'Digitizer input divider, three ranges', document: digitizerDividerRanges, settings: dividerSettings },
	{ name: 'Photodiode TIA, 100 kΩ', document: photodiodeTia },
	{ name: 'Anti-alias filter, 100 kHz', document: antiAliasFilter }
];

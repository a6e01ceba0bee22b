import { describe, expect, test } from 'vitest';
import { analyze } from '../../../src/lib/solver/index';
import { el, net } from './build';
import { exact, exactResponse, exactTransfer } from './exact-rational';

/**
 * A random RC network spanning ten decades of values (39 Ω … 851 MΩ, 2.6 pF … 9.5 mF), found by
 * an outside check against a 50-digit solve: its response fell to −423 dB, and the banded LU
 * read −422.949 dB there instead of −422.959 dB (0.1 % in |H|) while the agreement check blamed
 * the pole–zero form. One step of iterative refinement of each solve (Skeel 1980) fixes it.
 * Reference: exact rational arithmetic of the network's determinants (fraction.js).
 */
function spreadNetwork() {
	return net(
		[
			el('Vin', 'V', ['n0', 'gnd'], 1),
			el('R1', 'R', ['n0', 'n1'], 3.96e6),
			el('C2', 'C', ['n1', 'gnd'], 1.746e-3),
			el('R3', 'R', ['n1', 'n2'], 7.479e6),
			el('C4', 'C', ['n2', 'gnd'], 70.24e-12),
			el('R5', 'R', ['n2', 'n3'], 850.7e6),
			el('C6', 'C', ['n3', 'gnd'], 8.734e-12),
			el('C7', 'C', ['n1', 'n3'], 124.9e-6),
			el('R8', 'R', ['n3', 'n4'], 85.98e6),
			el('C9', 'C', ['n4', 'gnd'], 2.623e-12),
			el('R10', 'R', ['n4', 'n5'], 34.61e6),
			el('C11', 'C', ['n5', 'gnd'], 1.431e-6),
			el('R12', 'R', ['n5', 'gnd'], 141.3),
			el('R13', 'R', ['n5', 'n6'], 39.4),
			el('C14', 'C', ['n6', 'gnd'], 79.81e-12),
			el('R15', 'R', ['n6', 'gnd'], 199.9),
			el('R16', 'R', ['n6', 'n7'], 254.3e3),
			el('C17', 'C', ['n7', 'gnd'], 265.6e-6),
			el('R18', 'R', ['n7', 'n8'], 994.8e3),
			el('C19', 'C', ['n8', 'gnd'], 4.212e-6),
			el('C20', 'C', ['n6', 'n8'], 9.475e-3)
		],
		'n8'
	);
}

describe('a ten-decade RC network read far down its skirt', () => {
	test('every point of the response equals exact rational arithmetic (|H| to 1e-9 relative)', () => {
		const doc = spreadNetwork();
		const a = analyze(doc, { frequency: { points: 60 }, step: false });
		const t = exactTransfer(doc);
		const fr = a.frequencyResponse!;
		let lowest = 0;
		fr.f.forEach((f, k) => {
			const ref = exactResponse(t, exact(2 * Math.PI * f));
			lowest = Math.min(lowest, ref.db);
			// 1e-9 relative in |H| is 8.7e-9 dB.
			expect(Math.abs(fr.magnitudeDb[k]! - ref.db), `${f.toPrecision(4)} Hz: ${fr.magnitudeDb[k]} vs ${ref.db} dB`).toBeLessThan(8.7e-9);
		});
		expect(lowest).toBeLessThan(-300);
		expect(a.warnings.map((w) => w.code)).not.toContain('pole_zero_disagreement');
	});
});

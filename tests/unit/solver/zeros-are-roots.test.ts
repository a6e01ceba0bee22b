import { describe, expect, test } from 'vitest';
import { analyze, validateNetwork } from '../../../src/lib/solver/index';
import { assemble } from '../../../src/lib/solver/assemble';
import { directSystem } from '../../../src/lib/solver/direct-solve';
import { denseLadder, denseMesh } from '../../../scripts/lib/dense-networks';
import { randomNetwork } from './random-networks';
import { newtonStep } from './helpers';

/**
 * Every reported zero is a root of the transfer of the network equations: the Newton step
 * H(z)/H′(z) of the banded direct solve (G + zC)·x = b (no eigenproblem, no pole–zero form)
 * is below 1e-9·|z| (by definition of a zero: near a simple root H/H′ = z′ − z). Dense spectra
 * put every zero candidate within 1 % of some pole; the residue test beside a pole then
 * returned its first guess even when Newton did not confirm it — zeros 0.1–1 % off (Newton
 * steps of 1e-3·|z| on the mesh below) and a "recovered" zero at the end of a plain RC ladder,
 * whose numerator is a constant (a fact of the trade: an RC ladder read at its far end has all
 * its transmission zeros at infinity).
 */
function step(doc: unknown, z: { re: number; im: number }): number {
	return newtonStep(directSystem(assemble(validateNetwork(doc), () => 'pencil')), z);
}

describe('reported zeros are roots of the network equations (1e-9)', () => {
	// [name, network, whether its pole–zero form agrees with the network equations (it did not
	// for the mesh while its zeros were off)].
	const cases: [string, unknown, boolean][] = [
		['the bench mesh of 100 capacitors (50 poles in two decades)', denseMesh(100), true],
		[
			'an active mesh with transconductors (random, seed 2022)',
			randomNetwork('active', 140, 2022),
			false
		],
		[
			'an active mesh with complex zeros (random, seed 2026)',
			randomNetwork('active', 160, 2026),
			false
		],
		['an RC mesh (random, seed 2011)', randomNetwork('rc-floating', 85, 2011), false]
	];
	for (const [name, doc, agrees] of cases)
		test(name, () => {
			const a = analyze(doc, { step: false });
			let checked = 0;
			for (const z of a.zeros) {
				if (z.re === 0 && z.im === 0) continue;
				// A zero on its pole to 1e-9 cancels it: H is regular there and does not show it.
				const mag = Math.hypot(z.re, z.im);
				if (a.poles.some((p) => Math.hypot(p.re - z.re, p.im - z.im) < 1e-9 * mag)) continue;
				expect(step(doc, z), `zero ${z.re} + j${z.im}`).toBeLessThan(1e-9);
				checked++;
			}
			expect(checked).toBeGreaterThan(5);
			if (agrees) expect(a.warnings.map((w) => w.code)).not.toContain('pole_zero_disagreement');
		});

	test('a plain RC ladder of 50 sections read at its end has no finite zero', () => {
		const a = analyze(denseLadder(50), { step: false });
		expect(a.zeros).toEqual([]);
		const codes = a.warnings.map((w) => w.code);
		expect(codes).not.toContain('zero_recovered');
		expect(codes).not.toContain('pole_zero_disagreement');
	});
});

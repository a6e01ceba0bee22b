import { el, net, type El } from './build';

/**
 * The five network classes of issue 12 ("Numbers a designer can bet on"), our own instances:
 * each gave a silent wrong number before the responses came from the network equations.
 */

/** 1. A 10:1 compensated probe whose cable is a lumped LC line of `sections` sections. The tip
 *  time constant Rt·Ct is set `mismatch` (relative) away from the input side's, so the tip zero
 *  sits that far from a pole. Cable: 100 pF and 250 nH per metre, 1.2 m (common practice for a
 *  50–60 Ω coaxial cable). */
export function lcProbe(sections = 20, mismatch = 2e-5) {
	const Rt = 9e6;
	const Rin = 1e6;
	const Cin = 15e-12;
	const Ccable = 120e-12;
	const Lcable = 300e-9;
	const Ct = ((Rin * (Cin + Ccable)) / Rt) * (1 + mismatch);
	const els: El[] = [
		el('Vin', 'V', ['src', 'gnd'], 1),
		el('Rs', 'R', ['src', 'tip'], 25),
		el('Rt', 'R', ['tip', 'x0'], Rt),
		el('Ct', 'C', ['tip', 'x0'], Ct)
	];
	for (let k = 1; k <= sections; k++) {
		els.push(el(`L${k}`, 'L', [`x${k - 1}`, `x${k}`], Lcable / sections));
		els.push(el(`C${k}`, 'C', [`x${k}`, 'gnd'], Ccable / sections));
	}
	els.push(
		el('Rin', 'R', [`x${sections}`, 'gnd'], Rin),
		el('Cin', 'C', [`x${sections}`, 'gnd'], Cin)
	);
	return net(els, `x${sections}`);
}

/** 2. A compensated divider driven straight from a voltage source (no source resistance).
 *  Closed form: Zin = R1/(1 + sR1C1) + R2/(1 + sR2C2). */
export const stiffDivider = { R1: 9e6, C1: 10e-12, R2: 1e6, C2: 95e-12 };
export function stiffDividerNet() {
	const { R1, C1, R2, C2 } = stiffDivider;
	return net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'out'], R1),
			el('C1', 'C', ['in', 'out'], C1),
			el('R2', 'R', ['out', 'gnd'], R2),
			el('C2', 'C', ['out', 'gnd'], C2)
		],
		'out'
	);
}

/** 3. `n` equal RC sections separated by unity-gain buffers (VCVS, gain 1): an n-fold pole at
 *  −1/RC. Closed form step: 1 − e^{−x} Σ_{k<n} x^k/k!, x = t/RC. */
export function bufferedRc(n = 4, R = 1e3, C = 10e-9) {
	const els: El[] = [el('Vin', 'V', ['b0', 'gnd'], 1)];
	for (let k = 1; k <= n; k++) {
		els.push(el(`R${k}`, 'R', [`b${k - 1}`, `a${k}`], R), el(`C${k}`, 'C', [`a${k}`, 'gnd'], C));
		if (k < n) els.push(el(`E${k}`, 'VCVS', [`b${k}`, 'gnd', `a${k}`, 'gnd'], 1));
	}
	return net(els, `a${n}`);
}

/** 4. A current-controlled voltage source used as a −30 Ω·(reversed sensor current) resistance. */
export function ccvsResistor() {
	return net(
		[
			el('Vin', 'V', ['in', 'gnd'], 1),
			el('R1', 'R', ['in', 'a'], 375),
			el('C1', 'C', ['a', 'gnd'], '1n'),
			el('H1', 'CCVS', ['a', 'b'], -30, 'Vs'),
			el('Vs', 'V', ['c', 'b'], 0),
			el('C2', 'C', ['c', 'gnd'], '2n'),
			el('R2', 'R', ['c', 'gnd'], 1000)
		],
		'c'
	);
}

/** 5. An RC ladder (series R, shunt C) whose values span ten decades: R from 1 Ω to 10 GΩ,
 *  C from 1 mF to 1 fF. The transfer has no finite zero; no DC current flows from the source. */
export function tenDecadeLadder() {
	const R = [1, 10, 1e3, 1e5, 1e7, 1e9, 1e10];
	const C = [1e-3, 1e-5, 1e-7, 1e-9, 1e-11, 1e-13, 1e-15];
	const els: El[] = [el('Vin', 'V', ['x0', 'gnd'], 1)];
	R.forEach((r, i) => {
		els.push(el(`R${i + 1}`, 'R', [`x${i}`, `x${i + 1}`], r));
		els.push(el(`C${i + 1}`, 'C', [`x${i + 1}`, 'gnd'], C[i]));
	});
	return net(els, `x${R.length}`);
}

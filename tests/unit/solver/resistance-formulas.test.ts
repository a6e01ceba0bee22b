// The resistance each port sees, as a series–parallel formula of element names, against the
// solver's own reading and against exact rational arithmetic (mathjs fractions).
import { describe, expect, test } from 'vitest';
import { add, divide, fraction, number, type Fraction } from 'mathjs';
import { analyze } from '../../../src/lib/solver/index';
import { digitizerDivider } from '../../../src/lib/server/db/seed/demo-sheets';
import { mulberry32 } from '../../../src/lib/design/random';
import { el, expectRel, net, rel, type El } from './helpers';

describe('the demo divider: every R seen has a formula whose value is the number shown', () => {
	const a = analyze(digitizerDivider);
	const formulas = (kind: 'openCircuit' | 'shortCircuit') =>
		Object.fromEntries(a.timeConstants[kind].map((t) => [t.element, t.formula.formula]));
	test('hand reductions (common practice): Ctop sees Rtop ∥ (Rsrc + Radc) with the other port open, Rsrc ∥ Rtop with it shorted', () => {
		expect(formulas('openCircuit')).toEqual({
			Ctop: 'Rtop ∥ (Rsrc + Radc)',
			'Ccable + Cadc': 'Radc ∥ (Rsrc + Rtop)'
		});
		expect(formulas('shortCircuit')).toEqual({
			Ctop: 'Rsrc ∥ Rtop',
			'Ccable + Cadc': 'Rsrc ∥ Radc'
		});
	});
	test('each formula evaluates to the solver’s resistance (1e-12)', () => {
		for (const t of [...a.timeConstants.openCircuit, ...a.timeConstants.shortCircuit]) {
			expect(t.formula.kind).toBe('series-parallel');
			expectRel(t.formula.value, t.resistance!, 1e-12, `${t.element}: ${t.formula.formula}`);
		}
	});
});

/** A random series–parallel two-terminal network of resistors, with its exact resistance. */
function randomSeriesParallel(rand: () => number, decades: number) {
	const els: El[] = [];
	let node = 0;
	let count = 0;
	const grow = (a: string, b: string, depth: number): Fraction => {
		const leaf = depth >= 4 || count >= 14 || rand() < 0.3;
		if (leaf) {
			// Integer ohms, log-uniform over `decades` from 1 Ω, so the fractions stay exact.
			const r = Math.max(1, Math.round(10 ** (decades * rand())));
			els.push(el(`R${++count}`, 'R', [a, b], r));
			return fraction(r);
		}
		if (rand() < 0.5) {
			const m = `m${++node}`;
			return add(grow(a, m, depth + 1), grow(m, b, depth + 1)) as Fraction;
		}
		const x = grow(a, b, depth + 1);
		const y = grow(a, b, depth + 1);
		return divide(1, add(divide(1, x), divide(1, y))) as Fraction;
	};
	const exact = grow('a', 'gnd', 0);
	// A current input is open at DC, so the capacitor across a–gnd sees the resistors alone.
	const doc = net(
		[el('Iin', 'I', ['a', 'gnd'], 1e-3), ...els, el('Cp', 'C', ['a', 'gnd'], '1n')],
		'a',
		'Iin'
	);
	return { doc, exact: number(exact), resistors: els.map((e) => e.id) };
}

describe('300 random series–parallel networks (exact rational arithmetic with mathjs fractions)', () => {
	function run(decades: number, seed: number) {
		const rand = mulberry32(seed);
		let worstSolver = 0;
		let worstExact = 0;
		let worstSolverExact = 0;
		for (let run = 0; run < 300; run++) {
			const { doc, exact, resistors } = randomSeriesParallel(rand, decades);
			const t = analyze(doc, { frequency: false, step: false, expansion: false }).timeConstants
				.openCircuit[0];
			expect(t.formula.kind, `run ${run}`).toBe('series-parallel');
			const names = t.formula.formula!.match(/R\d+/g)!.sort();
			expect(names, `run ${run}: ${t.formula.formula}`).toEqual(resistors.slice().sort());
			worstSolver = Math.max(worstSolver, rel(t.formula.value!, t.resistance!));
			worstExact = Math.max(worstExact, rel(t.formula.value!, exact));
			worstSolverExact = Math.max(worstSolverExact, rel(t.resistance!, exact));
		}
		return { worstSolver, worstExact, worstSolverExact };
	}
	test('values over 3 decades: the formula names every resistor once; its value equals the solver’s R to 1e-12 and the exact rational value to 1e-14', () => {
		const w = run(3, 13);
		expect(w.worstSolver).toBeLessThan(1e-12);
		expect(w.worstExact).toBeLessThan(1e-14);
	});
	test('values over 7 decades: the formula stays exact to 1e-14; the solver’s nodal solve loses digits with the spread (measured 5e-10; bound 1e-9)', () => {
		// The formula adds and inverts positive numbers only, so it keeps full precision; the
		// nodal matrix of a network whose conductances span seven decades has a condition number
		// near 1e7, and the DC solve's relative error grows with it (about tenfold per decade).
		const w = run(7, 13);
		expect(w.worstExact).toBeLessThan(1e-14);
		expect(w.worstSolverExact).toBeLessThan(1e-9);
	});
});

describe('Wheatstone bridge: not series–parallel', () => {
	// Bridge between top t and gnd: R1 t–c, R2 t–d, R3 c–gnd, R4 d–gnd, R5 across c–d.
	const [R1, R2, R3, R4, R5] = [100, 220, 330, 470, 1000];
	const doc = net(
		[
			el('Iin', 'I', ['t', 'gnd'], 1e-3),
			el('R1', 'R', ['t', 'c'], R1),
			el('R2', 'R', ['t', 'd'], R2),
			el('R3', 'R', ['c', 'gnd'], R3),
			el('R4', 'R', ['d', 'gnd'], R4),
			el('R5', 'R', ['c', 'd'], R5),
			el('Cb', 'C', ['t', 'gnd'], '1n')
		],
		't',
		'Iin'
	);
	const t = analyze(doc).timeConstants.openCircuit[0];
	test('reported as not series–parallel, with the solver’s value', () => {
		expect(t.formula.kind).toBe('not-series-parallel');
		expect(t.formula.formula).toBeNull();
		expect(t.formula.reason).toMatch(/bridge/);
		expect(t.formula.value).toBe(t.resistance);
	});
	test('the value is the delta–star closed form (Kennelly, Electrical World and Engineer 34, 1899; from memory) (1e-12)', () => {
		const S = R1 + R2 + R5;
		const [ra, rc, rd] = [(R1 * R2) / S, (R1 * R5) / S, (R2 * R5) / S];
		const x = rc + R3;
		const y = rd + R4;
		expectRel(t.resistance, ra + (x * y) / (x + y), 1e-12, 'bridge R');
	});
	test('the resistors that matter most, by normalized sensitivity; all five sum to 1 (Euler: R is homogeneous of degree 1 in the resistances)', () => {
		expect(t.formula.influence).toHaveLength(3);
		const s = t.formula.influence.map((x) => Math.abs(x.sensitivity));
		expect(s).toEqual(s.slice().sort((x, y) => y - x));
		// The whole sum needs all five: read them from a second, unlimited look at the same bridge.
		const all = (['R1', 'R2', 'R3', 'R4', 'R5'] as const).map((id) => {
			const h = 1e-6;
			const vary = (f: number) =>
				analyze({
					...doc,
					elements: doc.elements.map((e) =>
						e.id === id ? { ...e, value: (e.value as number) * f } : e
					)
				}).timeConstants.openCircuit[0].resistance!;
			return (vary(1 + h) - vary(1 - h)) / (2 * h * t.resistance!);
		});
		expect(Math.abs(all.reduce((x, y) => x + y, 0) - 1)).toBeLessThan(1e-6);
		for (const x of t.formula.influence)
			expect(Math.abs(x.sensitivity - all[Number(x.element.slice(1)) - 1])).toBeLessThan(1e-6);
	});
});

describe('ports without a formula say why', () => {
	test('sources at zero and shorted ports join nodes; resistors hanging off carry no current', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('C1', 'C', ['in', 'x'], '1n'),
					el('R1', 'R', ['x', 'gnd'], '1k'),
					el('C2', 'C', ['x', 'y'], '1n'),
					el('R2', 'R', ['y', 'gnd'], '1k')
				],
				'y'
			)
		);
		const c1 = a.timeConstants.openCircuit[0];
		// Vin at zero joins in to gnd, so C1 (in–x) sees R1; R2 hangs off through the open C2.
		expect(c1.formula.formula).toBe('R1');
		// C1 shorted joins x to in = gnd: C2 (x–y) sees R2, and R1 (gnd–gnd) carries nothing.
		const sc = a.timeConstants.shortCircuit[1];
		expect(sc.formula.formula).toBe('R2');
		expectRel(sc.formula.value, sc.resistance!, 1e-12, 'C2 shorted');
	});
	test('a capacitor between two nodes with no resistive path: open', () => {
		const a = analyze(
			net(
				[
					el('Iin', 'I', ['a', 'gnd'], 1),
					el('R1', 'R', ['a', 'gnd'], '1k'),
					el('C1', 'C', ['a', 'b'], '1n'),
					el('C2', 'C', ['b', 'gnd'], '1n')
				],
				'a',
				'Iin'
			)
		);
		const c1 = a.timeConstants.openCircuit[0];
		expect(c1.formula.kind).toBe('open');
		expect(c1.formula.value).toBeNull();
		expect(c1.resistance).toBeNull();
	});
	test('a controlled source acting on the port: not series–parallel, named, value from the solver', () => {
		const a = analyze(
			net(
				[
					el('Vin', 'V', ['in', 'gnd'], 1),
					el('Rb', 'R', ['in', 'b'], '10k'),
					el('Cmu', 'C', ['b', 'c'], '1p'),
					el('Gm', 'VCCS', ['c', 'gnd', 'b', 'gnd'], '40m'),
					el('Rc', 'R', ['c', 'gnd'], '5k')
				],
				'c'
			)
		);
		const f = a.timeConstants.openCircuit[0].formula;
		expect(f.kind).toBe('not-series-parallel');
		expect(f.reason).toContain('Gm');
		// Miller (common practice): Cmu sees Rb + Rc + gm·Rb·Rc.
		expectRel(f.value, 10e3 + 5e3 + 40e-3 * 10e3 * 5e3, 1e-10, 'Miller R');
		expect(f.influence.map((x) => x.element).sort()).toEqual(['Rb', 'Rc']);
	});
});

/**
 * Brent's two one-dimensional methods (R. P. Brent, "Algorithms for Minimization without
 * Derivatives", Prentice-Hall 1973, chapters 4 and 5), bounded: every loop has an iteration
 * limit and a non-finite guard, so a design aid never hangs on a strange network.
 */

export interface RootResult {
	x: number;
	fx: number;
	iterations: number;
}

/**
 * Zero of f in [a, b] where f(a) and f(b) differ in sign: inverse quadratic interpolation and
 * secant steps, falling back to bisection whenever they would not shrink the bracket enough.
 */
export function brentRoot(
	f: (x: number) => number,
	a: number,
	b: number,
	tol = 1e-12,
	maxIter = 200
): RootResult {
	let fa = f(a);
	let fb = f(b);
	if (!Number.isFinite(fa) || !Number.isFinite(fb) || fa * fb > 0)
		throw new RangeError('brentRoot needs a bracket with a sign change');
	if (fa === 0) return { x: a, fx: 0, iterations: 0 };
	let c = a;
	let fc = fa;
	let d = b - a;
	let e = d;
	for (let i = 1; i <= maxIter; i++) {
		if (fb * fc > 0) {
			c = a;
			fc = fa;
			d = b - a;
			e = d;
		}
		if (Math.abs(fc) < Math.abs(fb)) {
			[a, b, c] = [b, c, b];
			[fa, fb, fc] = [fb, fc, fb];
		}
		const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
		const m = 0.5 * (c - b);
		if (Math.abs(m) <= tol1 || fb === 0) return { x: b, fx: fb, iterations: i };
		if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
			const s = fb / fa;
			let p: number;
			let q: number;
			if (a === c) {
				p = 2 * m * s;
				q = 1 - s;
			} else {
				const qa = fa / fc;
				const r = fb / fc;
				p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
				q = (qa - 1) * (r - 1) * (s - 1);
			}
			if (p > 0) q = -q;
			else p = -p;
			if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
				e = d;
				d = p / q;
			} else {
				d = m;
				e = m;
			}
		} else {
			d = m;
			e = m;
		}
		a = b;
		fa = fb;
		b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
		fb = f(b);
		if (!Number.isFinite(fb)) throw new RangeError('the goal is not finite inside the bracket');
	}
	return { x: b, fx: fb, iterations: maxIter };
}

export interface MinResult {
	x: number;
	fx: number;
	iterations: number;
}

/**
 * Minimum of f on [a, b]: golden-section steps with parabolic interpolation where it behaves.
 * Golden-section alone guarantees linear convergence even on a V-shaped (non-smooth) minimum,
 * which is what a worst-case deviation looks like around a pole–zero cancellation.
 */
export function brentMinimize(
	f: (x: number) => number,
	a: number,
	b: number,
	tol = 1e-10,
	maxIter = 200
): MinResult {
	const golden = 0.381966011250105;
	let x = a + golden * (b - a);
	let w = x;
	let v = x;
	let fx = f(x);
	let fw = fx;
	let fv = fx;
	let d = 0;
	let e = 0;
	for (let i = 1; i <= maxIter; i++) {
		const m = 0.5 * (a + b);
		const tol1 = tol * Math.abs(x) + 1e-300;
		const tol2 = 2 * tol1;
		if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) return { x, fx, iterations: i };
		let useGolden = true;
		if (Math.abs(e) > tol1) {
			let r = (x - w) * (fx - fv);
			let q = (x - v) * (fx - fw);
			let p = (x - v) * q - (x - w) * r;
			q = 2 * (q - r);
			if (q > 0) p = -p;
			else q = -q;
			r = e;
			e = d;
			if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
				d = p / q;
				const u = x + d;
				if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
				useGolden = false;
			}
		}
		if (useGolden) {
			e = x < m ? b - x : a - x;
			d = golden * e;
		}
		const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
		let fu = f(u);
		if (!Number.isFinite(fu)) fu = Number.MAX_VALUE;
		if (fu <= fx) {
			if (u < x) b = x;
			else a = x;
			[v, fv, w, fw, x, fx] = [w, fw, x, fx, u, fu];
		} else {
			if (u < x) a = u;
			else b = u;
			if (fu <= fw || w === x) {
				[v, fv, w, fw] = [w, fw, u, fu];
			} else if (fu <= fv || v === x || v === w) {
				v = u;
				fv = fu;
			}
		}
	}
	return { x, fx, iterations: maxIter };
}

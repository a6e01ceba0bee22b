import { SolverError } from './errors';
import type { Hessenberg } from './hessenberg';

export { hessenberg, type Hessenberg } from './hessenberg';

/**
 * Eigenvalues of a real non-symmetric matrix: balancing, Householder reduction to Hessenberg
 * form (keeping Q for the eigenvectors and the Hessenberg-form frequency solves), then the
 * Francis double-shift QR iteration on the active window only (eigenvalues-only variant of the
 * EISPACK hqr procedure, as in the public-domain JAMA package). Flat Float64Arrays: the
 * ml-matrix decomposition takes about a minute at n = 1000, this takes a few seconds.
 */
export interface Eigenvalues {
	re: Float64Array;
	im: Float64Array;
}

/** Francis double-shift QR on a copy of the Hessenberg matrix; bounded at 60·n sweeps. */
export function hqr(hs: Hessenberg): Eigenvalues {
	const nn = hs.n;
	const H = hs.h.slice();
	// H[i·nn + j] is written out at every use: reading through a small closure kept V8 from
	// keeping the doubles unboxed (2.4× slower and a heap number per read at n = 151).
	const d = new Float64Array(nn);
	const e = new Float64Array(nn);
	const eps = Number.EPSILON;
	let norm = 0;
	for (let i = 0; i < nn; i++)
		for (let j = Math.max(i - 1, 0); j < nn; j++) norm += Math.abs(H[i * nn + j]);
	let n = nn - 1;
	let exshift = 0;
	let iter = 0;
	let total = 0;
	let p = 0,
		q = 0,
		r = 0,
		s = 0,
		z = 0,
		w = 0,
		x = 0,
		y = 0;
	while (n >= 0) {
		if (++total > 60 * nn + 100) {
			throw new SolverError('singular', 'the eigenvalue iteration did not converge');
		}
		let l = n;
		while (l > 0) {
			s = Math.abs(H[(l - 1) * nn + (l - 1)]) + Math.abs(H[l * nn + l]);
			if (s === 0) s = norm;
			if (Math.abs(H[l * nn + (l - 1)]) < eps * s) break;
			l--;
		}
		if (l === n) {
			d[n] = H[n * nn + n] + exshift;
			e[n] = 0;
			n--;
			iter = 0;
		} else if (l === n - 1) {
			w = H[n * nn + (n - 1)] * H[(n - 1) * nn + n];
			p = (H[(n - 1) * nn + (n - 1)] - H[n * nn + n]) / 2;
			q = p * p + w;
			z = Math.sqrt(Math.abs(q));
			x = H[n * nn + n] + exshift;
			if (q >= 0) {
				z = p >= 0 ? p + z : p - z;
				d[n - 1] = x + z;
				d[n] = z !== 0 ? x - w / z : x + z;
				e[n - 1] = 0;
				e[n] = 0;
			} else {
				d[n - 1] = x + p;
				d[n] = x + p;
				e[n - 1] = z;
				e[n] = -z;
			}
			n -= 2;
			iter = 0;
		} else {
			x = H[n * nn + n];
			y = 0;
			w = 0;
			if (l < n) {
				y = H[(n - 1) * nn + (n - 1)];
				w = H[n * nn + (n - 1)] * H[(n - 1) * nn + n];
			}
			if (iter === 10) {
				exshift += x;
				for (let i = 0; i <= n; i++) H[i * nn + i] -= x;
				s = Math.abs(H[n * nn + (n - 1)]) + Math.abs(H[(n - 1) * nn + (n - 2)]);
				x = y = 0.75 * s;
				w = -0.4375 * s * s;
			}
			if (iter === 30) {
				s = (y - x) / 2;
				s = s * s + w;
				if (s > 0) {
					s = Math.sqrt(s);
					if (y < x) s = -s;
					s = x - w / ((y - x) / 2 + s);
					for (let i = 0; i <= n; i++) H[i * nn + i] -= s;
					exshift += s;
					x = y = w = 0.964;
				}
			}
			iter++;
			let m = n - 2;
			while (m >= l) {
				z = H[m * nn + m];
				r = x - z;
				s = y - z;
				p = (r * s - w) / H[(m + 1) * nn + m] + H[m * nn + (m + 1)];
				q = H[(m + 1) * nn + (m + 1)] - z - r - s;
				r = H[(m + 2) * nn + (m + 1)];
				s = Math.abs(p) + Math.abs(q) + Math.abs(r);
				p /= s;
				q /= s;
				r /= s;
				if (m === l) break;
				const lhs = Math.abs(H[m * nn + (m - 1)]) * (Math.abs(q) + Math.abs(r));
				const rhs =
					eps *
					(Math.abs(p) *
						(Math.abs(H[(m - 1) * nn + (m - 1)]) +
							Math.abs(z) +
							Math.abs(H[(m + 1) * nn + (m + 1)])));
				if (lhs < rhs) break;
				m--;
			}
			for (let i = m + 2; i <= n; i++) {
				H[i * nn + i - 2] = 0;
				if (i > m + 2) H[i * nn + i - 3] = 0;
			}
			for (let k = m; k <= n - 1; k++) {
				const notlast = k !== n - 1;
				if (k !== m) {
					p = H[k * nn + (k - 1)];
					q = H[(k + 1) * nn + (k - 1)];
					r = notlast ? H[(k + 2) * nn + (k - 1)] : 0;
					x = Math.abs(p) + Math.abs(q) + Math.abs(r);
					if (x !== 0) {
						p /= x;
						q /= x;
						r /= x;
					}
				}
				if (x === 0) break;
				s = Math.sqrt(p * p + q * q + r * r);
				if (p < 0) s = -s;
				if (s === 0) continue;
				if (k !== m) H[k * nn + k - 1] = -s * x;
				else if (l !== m) H[k * nn + k - 1] = -H[k * nn + (k - 1)];
				p += s;
				x = p / s;
				y = q / s;
				z = r / s;
				q /= p;
				r /= p;
				// Eigenvalues only: rows and columns outside the active window l..n never feed back.
				for (let j = k; j <= n; j++) {
					p = H[k * nn + j] + q * H[(k + 1) * nn + j];
					if (notlast) {
						p += r * H[(k + 2) * nn + j];
						H[(k + 2) * nn + j] -= p * z;
					}
					H[k * nn + j] -= p * x;
					H[(k + 1) * nn + j] -= p * y;
				}
				const top = Math.min(n, k + 3);
				for (let i = l; i <= top; i++) {
					p = x * H[i * nn + k] + y * H[i * nn + (k + 1)];
					if (notlast) {
						p += z * H[i * nn + (k + 2)];
						H[i * nn + k + 2] -= p * r;
					}
					H[i * nn + k] -= p;
					H[i * nn + k + 1] -= p * q;
				}
			}
		}
	}
	for (let i = 0; i < nn; i++) {
		if (!Number.isFinite(d[i]) || !Number.isFinite(e[i])) {
			throw new SolverError('singular', 'the eigenvalue iteration produced a non-finite value');
		}
	}
	return { re: d, im: e };
}

/**
 * Independent numerical tools for the tests of this folder (not used by the app): an adaptive Dormand–Prince
 * RK5(4) integrator (Dormand & Prince, J. Comput. Appl. Math. 6, 19 (1980); Hairer, Nørsett & Wanner, Solving
 * Ordinary Differential Equations I, §II.5) and adaptive Simpson quadrature.
 */
export function rk45(f: (t: number, y: number[]) => number[], y0: number[], t0: number, t1: number, tol = 1e-10, onStep?: (t: number, y: number[]) => boolean | void): { t: number; y: number[] } {
	const c = [0, 1 / 5, 3 / 10, 4 / 5, 8 / 9, 1, 1];
	const a = [
		[],
		[1 / 5],
		[3 / 40, 9 / 40],
		[44 / 45, -56 / 15, 32 / 9],
		[19372 / 6561, -25360 / 2187, 64448 / 6561, -212 / 729],
		[9017 / 3168, -355 / 33, 46732 / 5247, 49 / 176, -5103 / 18656],
		[35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84]
	];
	const b5 = [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84, 0];
	const b4 = [5179 / 57600, 0, 7571 / 16695, 393 / 640, -92097 / 339200, 187 / 2100, 1 / 40];
	let t = t0, y = y0.slice(), h = (t1 - t0) / 1000;
	const n = y.length;
	for (let guard = 0; guard < 1e6 && t < t1; guard++) {
		if (t + h > t1) h = t1 - t;
		const k: number[][] = [];
		for (let s = 0; s < 7; s++) {
			const ys = y.map((yi, i) => yi + h * a[s].reduce((acc, aj, j) => acc + aj * k[j][i], 0));
			k.push(f(t + c[s] * h, ys));
		}
		const y5 = y.map((yi, i) => yi + h * b5.reduce((acc, bj, j) => acc + bj * k[j][i], 0));
		const y4 = y.map((yi, i) => yi + h * b4.reduce((acc, bj, j) => acc + bj * k[j][i], 0));
		let err = 0;
		for (let i = 0; i < n; i++) err = Math.max(err, Math.abs(y5[i] - y4[i]) / (tol * (1 + Math.abs(y5[i]))));
		if (err <= 1) {
			t += h;
			y = y5;
			if (onStep && onStep(t, y) === true) break;
		}
		h *= Math.min(5, Math.max(0.2, 0.9 * Math.pow(err > 0 ? err : 1e-10, -0.2)));
	}
	return { t, y };
}

export function adaptiveSimpson(f: (x: number) => number, a: number, b: number, tol = 1e-12): number {
	const simpson = (lo: number, hi: number, flo: number, fm: number, fhi: number) => ((hi - lo) / 6) * (flo + 4 * fm + fhi);
	const rec = (lo: number, hi: number, flo: number, fm: number, fhi: number, whole: number, depth: number): number => {
		const m = (lo + hi) / 2, lm = (lo + m) / 2, rm = (m + hi) / 2;
		const flm = f(lm), frm = f(rm);
		const left = simpson(lo, m, flo, flm, fm), right = simpson(m, hi, fm, frm, fhi);
		if (depth > 40 || Math.abs(left + right - whole) < 15 * tol) return left + right + (left + right - whole) / 15;
		return rec(lo, m, flo, flm, fm, left, depth + 1) + rec(m, hi, fm, frm, fhi, right, depth + 1);
	};
	const fa = f(a), fm = f((a + b) / 2), fb = f(b);
	return rec(a, b, fa, fm, fb, simpson(a, b, fa, fm, fb), 0);
}

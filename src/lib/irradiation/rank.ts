/**
 * Rank every allowed lamp × wall (thickness) × solvent combination by the photon flux absorbed by
 * the substrate, q_abs,S = ∫ q(λ)·T_wall(λ)·f_S(λ) dλ with f_S = (A_S/A_tot)(1 − 10^(−A_tot))
 * (PRODUCT.md; IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293
 * (2007)); selectivity = q_abs,S / Σ_i q_abs,i. Trapezoid rule on the uniform grid.
 *
 * Benchmarked hot path. Grid work is shared across combinations: per solvent the two absorbed-fraction
 * arrays f_S(λ) and f_species(λ) are computed once; per lamp × wall the product q·T·w_trapezoid is
 * computed once, on the lamp's support only; each combination is then two fused dot products, and
 * solvents that add nothing to A_tot (in double precision) over a pair's support share one result.
 */
import { absorbedFractionPerAbsorbance } from './innerFilter';
import type { NumberArray } from './wavelengthGrid';

export interface RankLamp { id: string; name: string; photonFluxPerNm: NumberArray }
export interface RankWall { id: string; name: string; transmission: NumberArray }
export interface RankSolvent { id: string; name: string; absorbancePerCm: NumberArray }

export interface RankInput {
	stepNm: number;
	/** Optical depth of the liquid, cm (scales the solvent absorbance per cm). */
	pathCm: number;
	/** Substrate absorbance over the path. */
	substrateAbsorbance: NumberArray;
	/** Sum of the other species' absorbance over the path (photocatalyst, additives, product…). */
	otherAbsorbance?: NumberArray;
	lamps: RankLamp[];
	walls: RankWall[];
	solvents: RankSolvent[];
	/** Leave out combinations that are not allowed (e.g. a solvent that attacks a polymer wall). Default: all allowed. */
	isAllowed?: (lampIndex: number, wallIndex: number, solventIndex: number) => boolean;
}

export interface RankOptions {
	/**
	 * Lamp × wall products below this fraction of their own maximum are dropped at the two ends of
	 * the spectrum (never inside it). Absolute error ≤ negligibleFraction·max(q·T)·(grid span) — about
	 * 1e-10 of the lamp's flux at the default 1e-12. Set 0 for the untrimmed integral.
	 */
	negligibleFraction?: number;
}

export interface Ranking {
	lampCount: number;
	wallCount: number;
	solventCount: number;
	/** q_abs,S per combination, einstein s⁻¹; index (lamp·wallCount + wall)·solventCount + solvent. */
	substrateFluxEinsteinPerS: Float64Array;
	/** Σ_i q_abs,i (all species, not the solvent) per combination, einstein s⁻¹. */
	speciesFluxEinsteinPerS: Float64Array;
	/** ∫q dλ of each lamp, einstein s⁻¹. */
	lampFluxEinsteinPerS: Float64Array;
	/** Allowed combination indices, best first (q_abs,S descending, then selectivity). */
	order: Uint32Array;
}

/** Compute q_abs,S and Σq_abs for every combination and the ranking order. */
export function rankCombinations(input: RankInput, options: RankOptions = {}): Ranking {
	const cutFraction = options.negligibleFraction ?? 1e-12;
	const { lamps, walls, solvents, stepNm, pathCm, substrateAbsorbance: aS, otherAbsorbance: aO } = input;
	const n = aS.length;
	const L = lamps.length, W = walls.length, S = solvents.length;

	// Per lamp: incident flux and support; per lamp × wall: q·T·w (trapezoid weight) on that support.
	const lampFlux = new Float64Array(L);
	const pairLo = new Int32Array(L * W), pairLen = new Int32Array(L * W), pairOff = new Int32Array(L * W);
	const lampLo = new Int32Array(L), lampHi = new Int32Array(L);
	let total = 0;
	for (let l = 0; l < L; l++) {
		const q = lamps[l].photonFluxPerNm;
		let max = 0, sum = 0;
		for (let i = 0; i < n; i++) {
			const v = q[i];
			sum += v;
			if (v > max) max = v;
		}
		lampFlux[l] = n > 1 ? stepNm * (sum - 0.5 * (q[0] + q[n - 1])) : 0;
		const cut = max * cutFraction;
		let lo = 0, hi = n - 1;
		while (lo <= hi && !(q[lo] > cut)) lo++;
		while (hi >= lo && !(q[hi] > cut)) hi--;
		lampLo[l] = lo;
		lampHi[l] = hi;
		total += (hi - lo + 1) * W;
	}
	let uLo = n, uHi = -1;
	for (let l = 0; l < L; l++) {
		if (lampLo[l] < uLo) uLo = lampLo[l];
		if (lampHi[l] > uHi) uHi = lampHi[l];
	}

	// Per solvent, interleaved: f[2i] = f_S(λ_i) = A_S·g, f[2i+1] = f_species(λ_i) = (A_S + A_others)·g,
	// g = (1 − 10^(−A_tot))/A_tot, A_tot = A_S + A_others + A_solv (IUPAC 2007 inner-filter fraction).
	// Only the union of the lamps' supports [uLo, uHi] is ever read. Slot S holds the solvent-free
	// arrays. `changed` counts, per solvent, the grid points where adding the solvent changes A_tot at
	// all in double precision: where it does not, f is bit-for-bit the solvent-free f, so a
	// combination whose support has no such point reuses the solvent-free result (exact, not a tolerance).
	const f = new Float64Array(2 * (S + 1) * n);
	const changed = new Int32Array(S * (n + 1));
	for (let s = 0; s <= S; s++) {
		const solv = s < S ? solvents[s].absorbancePerCm : null;
		const base = 2 * s * n;
		for (let i = uLo; i <= uHi; i++) {
			const sp = aO ? aS[i] + aO[i] : aS[i];
			const aTot = solv ? sp + solv[i] * pathCm : sp;
			const g = absorbedFractionPerAbsorbance(aTot);
			f[base + 2 * i] = aS[i] * g;
			f[base + 2 * i + 1] = sp * g;
			if (solv) changed[s * (n + 1) + i + 1] = changed[s * (n + 1) + i] + (aTot !== sp ? 1 : 0);
		}
		if (solv) for (let i = uHi + 1; i < n; i++) changed[s * (n + 1) + i + 1] = changed[s * (n + 1) + i];
	}

	const prod = new Float64Array(Math.max(total, 1));
	let off = 0;
	for (let l = 0; l < L; l++) {
		const q = lamps[l].photonFluxPerNm;
		const lo = lampLo[l], hi = lampHi[l];
		for (let w = 0; w < W; w++) {
			const t = walls[w].transmission;
			const k = l * W + w;
			let max = 0;
			for (let i = lo; i <= hi; i++) {
				const wt = i === 0 || i === n - 1 ? 0.5 * stepNm : stepNm;
				const v = q[i] * t[i] * wt;
				prod[off + i - lo] = v;
				if (v > max) max = v;
			}
			// trim the tails of the product (e.g. a wall that cuts the lamp's short side)
			const cut = max * cutFraction;
			let a = lo, b = hi;
			while (a <= b && !(prod[off + a - lo] > cut)) a++;
			while (b >= a && !(prod[off + b - lo] > cut)) b--;
			pairOff[k] = off + a - lo;
			pairLo[k] = a;
			pairLen[k] = b - a + 1;
			off += hi - lo + 1;
		}
	}

	// Every combination: two fused dot products over the pair's support.
	const nc = L * W * S;
	const subs = new Float64Array(nc);
	const spec = new Float64Array(nc);
	const allowed = input.isAllowed;
	const order = new Uint32Array(nc);
	const full = new Int32Array(S); // solvents of the current pair that need their own dot products
	let m = 0;
	for (let l = 0; l < L; l++) {
		for (let w = 0; w < W; w++) {
			const k = l * W + w;
			const po = pairOff[k], lo = pairLo[k], len = pairLen[k];
			let baseA = -1, baseB = 0; // solvent-free result, computed when first needed
			let nf = 0;
			for (let s = 0; s < S; s++) {
				const idx = k * S + s;
				if (allowed && !allowed(l, w, s)) continue;
				order[m++] = idx;
				if (len <= 0) continue; // subs/spec stay 0
				const c = s * (n + 1);
				if (changed[c + lo + len] !== changed[c + lo]) {
					full[nf++] = s;
					continue;
				}
				if (baseA < 0) {
					dotTwo(prod, po, f, 2 * (S * n + lo), 2 * (S * n + lo), len);
					baseA = acc[0];
					baseB = acc[1];
				}
				subs[idx] = baseA;
				spec[idx] = baseB;
			}
			// two solvents per pass share the loads of the lamp × wall product
			for (let j = 0; j < nf; j += 2) {
				const s1 = full[j], s2 = j + 1 < nf ? full[j + 1] : full[j];
				dotTwo(prod, po, f, 2 * (s1 * n + lo), 2 * (s2 * n + lo), len);
				subs[k * S + s1] = acc[0];
				spec[k * S + s1] = acc[1];
				subs[k * S + s2] = acc[2];
				spec[k * S + s2] = acc[3];
			}
		}
	}
	const ranked = order.subarray(0, m);
	sortByFluxThenSelectivity(ranked, subs, spec);
	return { lampCount: L, wallCount: W, solventCount: S, substrateFluxEinsteinPerS: subs, speciesFluxEinsteinPerS: spec, lampFluxEinsteinPerS: lampFlux, order: ranked };
}

const acc = new Float64Array(4);
/**
 * Two solvents at once: acc = (Σ p_j·f_2j, Σ p_j·f_2j+1) from `fo`, then the same from `go`, for j < len,
 * p from `po`. Unrolled by 2 with separate accumulators; results go to the shared `acc` buffer (no
 * allocation per call).
 */
function dotTwo(p: Float64Array, po: number, f: Float64Array, fo: number, go: number, len: number): void {
	let a0 = 0, a1 = 0, b0 = 0, b1 = 0, c0 = 0, c1 = 0, d0 = 0, d1 = 0;
	let j = 0;
	for (; j + 1 < len; j += 2) {
		const p0 = p[po + j], p1 = p[po + j + 1];
		const x = fo + 2 * j, y = go + 2 * j;
		a0 += p0 * f[x]; b0 += p0 * f[x + 1]; a1 += p1 * f[x + 2]; b1 += p1 * f[x + 3];
		c0 += p0 * f[y]; d0 += p0 * f[y + 1]; c1 += p1 * f[y + 2]; d1 += p1 * f[y + 3];
	}
	if (j < len) {
		const p0 = p[po + j];
		const x = fo + 2 * j, y = go + 2 * j;
		a0 += p0 * f[x]; b0 += p0 * f[x + 1]; c0 += p0 * f[y]; d0 += p0 * f[y + 1];
	}
	acc[0] = a0 + a1;
	acc[1] = b0 + b1;
	acc[2] = c0 + c1;
	acc[3] = d0 + d1;
}

/**
 * Order `idx` by q_abs,S descending, ties by selectivity descending, then index ascending.
 * Non-negative doubles order like their IEEE-754 bit patterns read as unsigned integers, so a stable
 * LSD radix sort on the complemented bits (6 passes of 11/11/10 bits per 32-bit word) gives the
 * descending order in O(n) without a comparator; runs of equal flux are then fixed up with the
 * comparator. Any negative or NaN flux (invalid input upstream) falls back to the comparator sort.
 */
function sortByFluxThenSelectivity(idx: Uint32Array, subs: Float64Array, spec: Float64Array): void {
	const m = idx.length;
	const selectivity = (x: number) => (spec[x] > 0 ? subs[x] / spec[x] : 0);
	const byTie = (x: number, y: number) => selectivity(y) - selectivity(x) || x - y;
	for (let r = 0; r < m; r++) {
		if (!(subs[idx[r]] >= 0)) {
			idx.sort((x, y) => (subs[y] - subs[x] || byTie(x, y)) || 0);
			return;
		}
	}
	const words = new Uint32Array(subs.buffer, subs.byteOffset, subs.length * 2); // little-endian: [lo, hi]
	let src: Uint32Array = idx;
	let dst: Uint32Array = new Uint32Array(m);
	const count = new Int32Array(2048);
	for (let pass = 0; pass < 6; pass++) {
		const word = pass < 3 ? 0 : 1; // lo word first (least significant)
		const shift = (pass % 3) * 11;
		const mask = shift === 22 ? 0x3ff : 0x7ff;
		count.fill(0);
		for (let r = 0; r < m; r++) count[((~words[2 * src[r] + word]) >>> shift) & mask]++;
		let sum = 0;
		for (let d = 0; d <= mask; d++) {
			const c = count[d];
			count[d] = sum;
			sum += c;
		}
		for (let r = 0; r < m; r++) {
			const v = src[r];
			dst[count[((~words[2 * v + word]) >>> shift) & mask]++] = v;
		}
		const t = src;
		src = dst;
		dst = t;
	}
	// six passes: the sorted result is back in `idx`
	// equal flux: the stable passes left ascending index; re-sort only runs whose selectivities differ
	for (let r = 0; r < m; ) {
		let e = r + 1;
		let sameSpec = true;
		while (e < m && subs[idx[e]] === subs[idx[r]]) {
			if (spec[idx[e]] !== spec[idx[r]]) sameSpec = false;
			e++;
		}
		if (!sameSpec) idx.subarray(r, e).sort(byTie);
		r = e;
	}
}

export interface RankedCombination {
	rank: number;
	lampId: string;
	wallId: string;
	solventId: string;
	absorbedPhotonFluxEinsteinPerS: number;
	/** q_abs,S / Σ_i q_abs,i. */
	selectivity: number;
	/** q_abs,S / ∫q: share of the lamp's photons that end up in the substrate. */
	fractionOfLampPhotonsToSubstrate: number;
	/** e.g. "the 390 nm LED through 2 mm borosilicate 3.3 in acetonitrile: 71 % of its photons reach the substrate". */
	sentence: string;
}

/** The best `limit` combinations (default 10) as objects with display sentences; names come from the caller. */
export function rankedEntries(input: RankInput, ranking: Ranking, limit = 10): RankedCombination[] {
	const { wallCount: W, solventCount: S } = ranking;
	const out: RankedCombination[] = [];
	const m = Math.min(limit, ranking.order.length);
	for (let r = 0; r < m; r++) {
		const idx = ranking.order[r];
		const s = idx % S;
		const w = ((idx - s) / S) % W;
		const l = (idx - s - w * S) / (S * W);
		const subs = ranking.substrateFluxEinsteinPerS[idx];
		const spec = ranking.speciesFluxEinsteinPerS[idx];
		const lampFlux = ranking.lampFluxEinsteinPerS[l];
		const fraction = lampFlux > 0 ? subs / lampFlux : 0;
		const lamp = input.lamps[l], wall = input.walls[w], solvent = input.solvents[s];
		const inSolvent = S > 1 ? ` in ${solvent.name}` : '';
		out.push({
			rank: r + 1,
			lampId: lamp.id,
			wallId: wall.id,
			solventId: solvent.id,
			absorbedPhotonFluxEinsteinPerS: subs,
			selectivity: spec > 0 ? subs / spec : 0,
			fractionOfLampPhotonsToSubstrate: fraction,
			sentence: `the ${lamp.name} through ${wall.name}${inSolvent}: ${Math.round(fraction * 100)} % of its photons reach the substrate`
		});
	}
	return out;
}

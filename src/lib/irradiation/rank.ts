/**
 * Rank every allowed lamp × wall (thickness) × solvent combination by the photon flux absorbed by
 * the substrate, q_abs,S = ∫ q(λ)·T_wall(λ)·f_S(λ) dλ with f_S = (A_S/A_tot)(1 − 10^(−A_tot))
 * (PRODUCT.md; IUPAC Glossary of Terms Used in Photochemistry, 3rd ed., Pure Appl. Chem. 79, 293
 * (2007)); selectivity = q_abs,S / Σ_i q_abs,i. Trapezoid rule on the uniform grid.
 *
 * Benchmarked hot path. Grid work is shared across combinations: per solvent the two absorbed-fraction
 * arrays f_S(λ) and f_species(λ) are computed once; per lamp × wall the product q·T·w_trapezoid is
 * computed once, on the lamp's support only, with prefix sums of its solvent-free integrals; each
 * combination then adds one fused dot product over the stretch where its solvent absorbs at all.
 */
import { nameInSentence } from './names';
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
	/** Vessel geometry g(A) = F(A)/A (vessels.ts); default the flat layer (1 − 10^(−A))/A. */
	fractionPerAbsorbance?: (absorbance: number) => number;
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
	/**
	 * Solvent absorbance over the path below which the solvent is treated as absent (default 1e-12: the absorbed
	 * fractions then change by less than 2e-12 relative). Set 0 to include every solvent value.
	 */
	negligibleSolventAbsorbance?: number;
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
	// Slot S holds the solvent-free arrays. A solvent only matters where its absorbance over the path
	// reaches `negligibleSolventAbsorbance` (default 1e-12: below it f changes by < 2e-12 relative);
	// [solvLo[s], solvHi[s]] is that range, and outside it the solvent-free f is used. Only the union of
	// the lamps' supports [uLo, uHi] is ever read.
	const tolSolv = options.negligibleSolventAbsorbance ?? 1e-12;
	const gOf = input.fractionPerAbsorbance ?? absorbedFractionPerAbsorbance;
	const f = scratch(0, 2 * (S + 1) * n);
	const solvLo = new Int32Array(S), solvHi = new Int32Array(S);
	for (let s = S; s >= 0; s--) {
		const solv = s < S ? solvents[s].absorbancePerCm : null;
		let a = uLo, b = uHi;
		if (solv) {
			while (a <= b && !(solv[a] * pathCm >= tolSolv)) a++;
			while (b >= a && !(solv[b] * pathCm >= tolSolv)) b--;
			solvLo[s] = a;
			solvHi[s] = b;
		}
		const base = 2 * s * n;
		for (let i = a; i <= b; i++) {
			const sp = aO ? aS[i] + aO[i] : aS[i];
			const aTot = solv ? sp + solv[i] * pathCm : sp;
			const g = gOf(aTot);
			f[base + 2 * i] = aS[i] * g;
			f[base + 2 * i + 1] = sp * g;
		}
	}

	const prod = scratch(1, Math.max(total, 1));
	// Prefix sums of the solvent-free integrands over each pair's support: cum[2(off + j)] = Σ_{i<j} p·f_S,0.
	const cum = scratch(2, 2 * (total + L * W + 1));
	const cumOff = new Int32Array(L * W);
	let off = 0, coff = 0;
	const f0 = 2 * S * n;
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
			const po = off + a - lo, len = b - a + 1;
			pairOff[k] = po;
			pairLo[k] = a;
			pairLen[k] = len;
			cumOff[k] = coff;
			let sA = 0, sB = 0;
			cum[2 * coff] = 0;
			cum[2 * coff + 1] = 0;
			for (let j = 0; j < len; j++) {
				const p = prod[po + j], x = f0 + 2 * (a + j);
				sA += p * f[x];
				sB += p * f[x + 1];
				cum[2 * (coff + j + 1)] = sA;
				cum[2 * (coff + j + 1) + 1] = sB;
			}
			coff += Math.max(len, 0) + 1;
			off += hi - lo + 1;
		}
	}

	// Every combination: the solvent-free integral over the pair's support, corrected by one fused dot
	// product over the stretch where the solvent absorbs: Σ p·f_s − Σ p·f_0 on [from, to).
	const nc = L * W * S;
	const subs = new Float64Array(nc);
	const spec = new Float64Array(nc);
	const allowed = input.isAllowed;
	const order = new Uint32Array(nc);
	let m = 0;
	for (let l = 0; l < L; l++) {
		for (let w = 0; w < W; w++) {
			const k = l * W + w;
			const po = pairOff[k], lo = pairLo[k], len = pairLen[k], co = cumOff[k];
			if (len <= 0) {
				for (let s = 0; s < S; s++) if (!allowed || allowed(l, w, s)) order[m++] = k * S + s;
				continue;
			}
			const totA = cum[2 * (co + len)], totB = cum[2 * (co + len) + 1];
			for (let s = 0; s < S; s++) {
				const idx = k * S + s;
				if (allowed && !allowed(l, w, s)) continue;
				order[m++] = idx;
				const from = Math.max(lo, solvLo[s]);
				const to = Math.min(lo + len, solvHi[s] + 1);
				if (to <= from) {
					subs[idx] = totA;
					spec[idx] = totB;
					continue;
				}
				dotOne(prod, po + (from - lo), f, 2 * (s * n + from), to - from);
				const j0 = from - lo, j1 = to - lo;
				// rounding in the difference of prefix sums can leave −1e-30 where the true value is 0
				const a = totA - (cum[2 * (co + j1)] - cum[2 * (co + j0)]) + acc[0];
				const b = totB - (cum[2 * (co + j1) + 1] - cum[2 * (co + j0) + 1]) + acc[1];
				subs[idx] = a > 0 ? a : 0;
				spec[idx] = b > 0 ? b : 0;
			}
		}
	}
	const ranked = order.subarray(0, m);
	sortByFluxThenSelectivity(ranked, subs, spec);
	return { lampCount: L, wallCount: W, solventCount: S, substrateFluxEinsteinPerS: subs, speciesFluxEinsteinPerS: spec, lampFluxEinsteinPerS: lampFlux, order: ranked };
}

const acc = new Float64Array(4);

/**
 * Work buffers reused across calls (grown when a call needs more): the per-call arrays are megabytes, and
 * fresh allocations cost page faults that can dominate the ranking itself. Only regions written in the
 * current call are read, so stale contents never leak into a result.
 */
const buffers: Float64Array[] = [];
function scratch(slot: number, length: number): Float64Array {
	if (!buffers[slot] || buffers[slot].length < length) buffers[slot] = new Float64Array(Math.ceil(length * 1.25));
	return buffers[slot];
}
/** acc = (Σ p_j·f_2j, Σ p_j·f_2j+1) for j < len, p from `po`, f from `fo`; unrolled by 4, no allocation. */
function dotOne(p: Float64Array, po: number, f: Float64Array, fo: number, len: number): void {
	let a0 = 0, a1 = 0, a2 = 0, a3 = 0, b0 = 0, b1 = 0, b2 = 0, b3 = 0;
	let j = 0;
	for (; j + 3 < len; j += 4) {
		const q = po + j, x = fo + 2 * j;
		const p0 = p[q], p1 = p[q + 1], p2 = p[q + 2], p3 = p[q + 3];
		a0 += p0 * f[x]; b0 += p0 * f[x + 1];
		a1 += p1 * f[x + 2]; b1 += p1 * f[x + 3];
		a2 += p2 * f[x + 4]; b2 += p2 * f[x + 5];
		a3 += p3 * f[x + 6]; b3 += p3 * f[x + 7];
	}
	for (; j < len; j++) {
		const p0 = p[po + j];
		a0 += p0 * f[fo + 2 * j]; b0 += p0 * f[fo + 2 * j + 1];
	}
	acc[0] = a0 + a1 + (a2 + a3);
	acc[1] = b0 + b1 + (b2 + b3);
}

/**
 * Order `idx` by q_abs,S descending, ties by selectivity descending, then index ascending.
 * Non-negative doubles order like their IEEE-754 bit patterns read as unsigned integers, so a stable
 * LSD radix sort on the complemented top 44 bits gives the descending order in O(n) without a
 * comparator; runs that agree in those bits are then fixed up with the comparator. Any negative or NaN flux (invalid input upstream) falls back to the comparator sort.
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
	const count = new Int32Array(4096);
	// Four stable passes over the top 44 bits (lo word bits 20–31, then the hi word in 11/11/10 bits): values
	// that agree in those bits differ by less than 2^-32 relative and are put in order by the fix-up below.
	const WORD = [0, 1, 1, 1], SHIFT = [20, 0, 11, 22], MASK = [0xfff, 0x7ff, 0x7ff, 0x3ff];
	for (let pass = 0; pass < 4; pass++) {
		const word = WORD[pass], shift = SHIFT[pass], mask = MASK[pass];
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
	// four passes: the result is back in `idx`. Runs that agree in the top 44 bits keep ascending index order
	// (stable passes); re-sort a run only when its full flux or its selectivity differs.
	const full = (x: number, y: number) => subs[y] - subs[x] || byTie(x, y);
	for (let r = 0; r < m; ) {
		const hi = words[2 * idx[r] + 1], top = words[2 * idx[r]] >>> 20;
		let e = r + 1;
		let needed = false;
		while (e < m && words[2 * idx[e] + 1] === hi && words[2 * idx[e]] >>> 20 === top) {
			if (subs[idx[e]] !== subs[idx[r]] || (spec[idx[e]] !== spec[idx[r]] && subs[idx[r]] !== 0)) needed = true;
			e++;
		}
		if (needed) idx.subarray(r, e).sort(full);
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
export function rankedEntries(input: RankInput, ranking: Ranking, limit = 10, absorberWord = 'substrate'): RankedCombination[] {
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
			sentence: `the ${nameInSentence(lamp.name)} through ${wall.name}${inSolvent}: ${Math.round(fraction * 100)} % of its photons reach the ${absorberWord}`
		});
	}
	return out;
}

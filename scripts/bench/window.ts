/**
 * Benchmark of the Window finder's ranking hot path (not a timed test).
 * Run: npx tsx scripts/bench/window.ts   (npm run bench:window)
 *
 * Ranks 40 lamps × 12 wall settings × 30 solvents for one substrate and two other absorbers on the
 * 0.5 nm computation grid with src/lib/irradiation/rank.ts, on synthetic inputs made here (Gaussian
 * absorption bands, Gaussian LEDs, logistic wall edges, solvent cut-off edge models — all invented),
 * prints the median time, then runs the same maths vectorised in numpy (window_numpy.py), checks that
 * both find the same best combination and prints `ratio JS/numpy: x.xx` as the last line.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { photonFluxEinsteinPerS } from '../../src/lib/irradiation/constants';
import { speciesAbsorbance } from '../../src/lib/irradiation/innerFilter';
import { rankCombinations, rankedEntries, type RankInput } from '../../src/lib/irradiation/rank';
import { COMPUTATION_GRID, gridWavelengths } from '../../src/lib/irradiation/wavelengthGrid';

const grid = COMPUTATION_GRID;
const wl = gridWavelengths(grid);
const n = grid.count;
const PATH_CM = 1;

/** Sum of Gaussian bands, ε in M⁻¹ cm⁻¹ (invented compounds). */
function bands(list: [peakNm: number, fwhmNm: number, epsMax: number][]): Float64Array {
	const out = new Float64Array(n);
	for (const [p, f, e] of list) for (let i = 0; i < n; i++) out[i] += e * Math.exp((-4 * Math.LN2 * (wl[i] - p) ** 2) / (f * f));
	return out;
}
/** Gaussian LED (common practice line shape) with `powerW` optical power → einstein s⁻¹ nm⁻¹. */
function led(peakNm: number, fwhmNm: number, powerW: number): Float64Array {
	const out = new Float64Array(n);
	const norm = (2 * Math.sqrt(Math.LN2 / Math.PI)) / fwhmNm; // area-normalised Gaussian
	for (let i = 0; i < n; i++) out[i] = photonFluxEinsteinPerS(powerW * norm * Math.exp((-4 * Math.LN2 * (wl[i] - peakNm) ** 2) / (fwhmNm * fwhmNm)), wl[i]);
	return out;
}
/** Logistic wall edge: T = Tmax / (1 + exp(−(λ − λ50)/w)). */
function wall(edgeNm: number, widthNm: number, tMax: number): Float64Array {
	const out = new Float64Array(n);
	for (let i = 0; i < n; i++) out[i] = tMax / (1 + Math.exp(-(wl[i] - edgeNm) / widthNm));
	return out;
}
/** Solvent cut-off edge model A_1cm = 10^((λc − λ)/s), s = 10 nm/decade (PRODUCT.md). */
function solvent(cutoffNm: number): Float64Array {
	const out = new Float64Array(n);
	for (let i = 0; i < n; i++) out[i] = 10 ** ((cutoffNm - wl[i]) / 10);
	return out;
}

const eps = [bands([[312, 38, 9000], [248, 30, 21000]]), bands([[452, 60, 14000], [290, 25, 60000]]), bands([[268, 30, 5000]])];
const conc = [0.02, 0.0005, 0.002];
const lamps = Array.from({ length: 40 }, (_, k) => {
	const peak = 255 + k * 10;
	return { id: `L${k}`, name: `${peak} nm LED`, photonFluxPerNm: led(peak, 10 + (k % 5) * 5, 1 + (k % 7)) };
});
const walls = Array.from({ length: 12 }, (_, k) => {
	const edge = 180 + k * 18;
	return { id: `W${k}`, name: `wall edge ${edge} nm`, transmission: wall(edge, 4 + (k % 3), 0.93 - 0.01 * (k % 4)) };
});
const solvents = Array.from({ length: 30 }, (_, k) => {
	const c = 190 + k * 6.5;
	return { id: `S${k}`, name: `solvent cut-off ${c} nm`, absorbancePerCm: solvent(c) };
});

function runOnce() {
	const a = eps.map((e, j) => speciesAbsorbance(e, conc[j], PATH_CM));
	const other = new Float64Array(n);
	for (let i = 0; i < n; i++) other[i] = a[1][i] + a[2][i];
	const input: RankInput = { stepNm: grid.stepNm, pathCm: PATH_CM, substrateAbsorbance: a[0], otherAbsorbance: other, lamps, walls, solvents };
	const ranking = rankCombinations(input);
	return { ranking, top: rankedEntries(input, ranking, 10) };
}

// Timing: ROUNDS rounds, each RUNS_PER_ROUND JS runs then RUNS_PER_ROUND numpy runs, so both see the same
// machine load (this machine is shared); the ratio is median(JS) / median(numpy) over all runs.
// Each side is timed in a fresh process of its own: on these machines a process that has spawned a child
// runs memory-heavy loops measurably slower afterwards, so the driver below never times JS itself.
const ROUNDS = 3;
const RUNS_PER_ROUND = 11;
const median = (xs: number[]) => [...xs].sort((x, y) => x - y)[xs.length >> 1];

if (process.argv.includes('--js-worker')) {
	// Warm-up: V8 needs a few dozen calls before the hot loops run optimised (tiering); numpy needs none.
	for (let r = 0; r < 40; r++) runOnce();
	const times: number[] = [];
	const cpu: number[] = [];
	let last = runOnce();
	for (let r = 0; r < RUNS_PER_ROUND; r++) {
		const c0 = process.cpuUsage();
		const t0 = performance.now();
		last = runOnce();
		times.push(performance.now() - t0);
		const c = process.cpuUsage(c0);
		cpu.push((c.user + c.system) / 1000);
	}
	const top = last.top[0];
	console.log(JSON.stringify({ times, cpu, topIndex: last.ranking.order[0], topFlux: top.absorbedPhotonFluxEinsteinPerS, sentence: top.sentence, selectivity: top.selectivity, count: last.ranking.order.length }));
} else {
	runDriver();
}

interface Timing { times: number[]; cpu: number[]; topIndex: number; topFlux: number; sentence?: string; selectivity?: number; count?: number }

function runDriver() {
	const here = fileURLToPath(import.meta.url);
	const dir = mkdtempSync(join(tmpdir(), 'window-bench-'));
	try {
		// numpy gets the same inputs as raw float64 rows.
		const rows = [...eps, ...lamps.map((l) => l.photonFluxPerNm), ...walls.map((w) => w.transmission), ...solvents.map((s) => s.absorbancePerCm)];
		const buf = new Float64Array(rows.length * n);
		rows.forEach((r, k) => buf.set(r, k * n));
		writeFileSync(join(dir, 'inputs.f64'), Buffer.from(buf.buffer));
		const meta = { n, stepNm: grid.stepNm, pathCm: PATH_CM, conc, species: eps.length, lamps: lamps.length, walls: walls.length, solvents: solvents.length, runs: RUNS_PER_ROUND };
		writeFileSync(join(dir, 'meta.json'), JSON.stringify(meta));
		const script = join(dirname(here), 'window_numpy.py');
		const js: Timing[] = [];
		const np: Timing[] = [];
		let skipped = '';
		// Rounds alternate JS and numpy so both see the same machine load.
		for (let round = 0; round < ROUNDS; round++) {
			const w = spawnSync(process.execPath, ['--import', 'tsx', here, '--js-worker'], { encoding: 'utf8' });
			if (w.status !== 0) throw new Error(`JS worker failed: ${w.stderr}`);
			js.push(JSON.parse(w.stdout.trim().split('\n').pop() as string));
			if (skipped) continue;
			const py = spawnSync('python3', [script, dir], { encoding: 'utf8' });
			if (py.error || py.status !== 0) {
				const why = py.error ? String(py.error.message) : ((py.stderr || '').trim().split('\n').pop() ?? '');
				skipped = /numpy/i.test(why) ? 'numpy is not installed for python3' : why || 'python3 failed';
				continue;
			}
			np.push(JSON.parse(py.stdout.trim().split('\n').pop() as string));
		}
		const jsTimes = js.flatMap((t) => t.times);
		const jsMs = median(jsTimes);
		const best = js[js.length - 1];
		console.log(`combinations: ${lamps.length} lamps × ${walls.length} walls × ${solvents.length} solvents = ${best.count}, grid ${n} points`);
		console.log(`best (JS): ${best.sentence}; q_abs,S = ${best.topFlux.toExponential(6)} einstein/s, selectivity ${best.selectivity?.toFixed(4)}`);
		console.log(`JS median of ${jsTimes.length} runs: ${jsMs.toFixed(2)} ms`);
		if (skipped || !np.length) {
			console.log(`numpy comparison skipped: ${skipped || 'no result'}`);
			console.log('ratio JS/numpy: n/a (numpy comparison skipped)');
			return;
		}
		const npTimes = np.flatMap((t) => t.times);
		const npMs = median(npTimes);
		console.log(`numpy median of ${npTimes.length} runs: ${npMs.toFixed(2)} ms`);
		// CPU time (all threads; numpy's BLAS may use both cores) is shown for information
		const jsCpu = median(js.flatMap((t) => t.cpu));
		const npCpu = median(np.flatMap((t) => t.cpu));
		console.log(`CPU time medians: JS ${jsCpu.toFixed(2)} ms, numpy ${npCpu.toFixed(2)} ms (ratio ${(jsCpu / npCpu).toFixed(2)})`);
		const top = np[np.length - 1];
		const rel = Math.abs(top.topFlux - best.topFlux) / best.topFlux;
		const same = top.topIndex === best.topIndex && rel < 1e-9;
		console.log(`same top result: ${same ? 'yes' : 'NO'} (JS index ${best.topIndex}, numpy index ${top.topIndex}, relative flux difference ${rel.toExponential(2)})`);
		if (!same) process.exitCode = 1;
		console.log(`ratio JS/numpy: ${(jsMs / npMs).toFixed(2)}`);
	} finally {
		rmSync(dir, { recursive: true, force: true });
	}
}

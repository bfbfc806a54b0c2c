/**
 * Benchmark: reading a kinetics upload (4 invented tables, 35 time rows × 911 wavelengths each, the shape of the
 * diode-array exports that used to be read transposed). Times the upload's pure part — parse, normalise, derive
 * (prepareSpectra) — against a baseline measured in the same run: papaparse splitting the same text into fields
 * (the least any delimited reader must do). Both sides are timed as CPU time of this process (user + system),
 * single thread, best of 3. The last line is the ratio.
 */
import Papa from 'papaparse';
import { prepareSpectra } from '../../src/lib/server/services/spectraPrepare';

const wavelengths = Array.from({ length: 911 }, (_, i) => 190 + i);
const band = (nm: number, c: number, w: number) => Math.exp(-(((nm - c) / w) ** 2) / 2);
function table(tau: number, d: string): string {
	const rows = [['Time (s)', ...wavelengths].join(d)];
	for (let k = 0; k < 35; k++) {
		const t = 30 * k;
		rows.push([t, ...wavelengths.map((nm) => (0.9 * Math.exp(-t / tau) * band(nm, 420, 25) + 0.6 * (1 - Math.exp(-t / tau)) * band(nm, 330, 20) + 0.02).toFixed(5))].join(d));
	}
	return rows.join('\r\n');
}
const files = [table(200, ','), table(300, ','), table(450, '\t'), table(600, ';')].map((t) => new TextEncoder().encode(t));

function cpuMs(f: () => void): number {
	let best = Infinity;
	for (let r = 0; r < 3; r++) {
		const a = process.cpuUsage();
		f();
		const b = process.cpuUsage(a);
		best = Math.min(best, (b.user + b.system) / 1000);
	}
	return best;
}

let total = 0, base = 0;
files.forEach((bytes, i) => {
	let n = 0;
	const ms = cpuMs(() => (n = prepareSpectra(bytes, `kinetics-${i + 1}.csv`, {}).spectra.length));
	const text = new TextDecoder().decode(bytes);
	const b = cpuMs(() => void Papa.parse(text, { delimiter: i === 2 ? '\t' : i === 3 ? ';' : ',' }));
	total += ms;
	base += b;
	console.log(`kinetics-${i + 1}.csv: ${n} spectra, parse+normalise+derive ${ms.toFixed(0)} ms CPU (papaparse split alone ${b.toFixed(0)} ms)`);
});
console.log(`4 files: ${total.toFixed(0)} ms CPU in all, ${(total / 4).toFixed(0)} ms per file (target < 1000 ms per upload)`);
console.log(`ratio reader / papaparse split: ${(total / base).toFixed(2)}`);

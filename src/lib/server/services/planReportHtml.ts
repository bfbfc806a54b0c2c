/**
 * The printable HTML report: a standalone page (no app navigation) with print CSS, the overlay as inline SVG,
 * the checklist table, the methods paragraph and the cautions ending with the deferral. Every value is escaped.
 */
import type { PlanReport } from './planReport';
import { clippedNote, overlayFrame } from './planReportPlot';

const esc = (s: unknown) => String(s ?? '').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** Series colours of the overlay (the app's own palette: ink for absorbers, glass for walls, lumen for light). */
export const SERIES_COLOURS = { absorbance: ['#26324a', '#7d4fd6', '#8c9dbd', '#b8731a'], transmission: '#276e65', emission: '#e9a23b' } as const;

/** The overlay as an SVG: absorbance on the left axis (0 to the largest value shown, at most 3), T and emission 0–1 on the right. */
export function overlaySvg(curves: NonNullable<PlanReport['curves']>, width = 720, height = 260): string {
	const pad = { l: 46, r: 46, t: 12, b: 34 };
	const w = width - pad.l - pad.r;
	const h = height - pad.t - pad.b;
	const x = curves.x;
	const frame = overlayFrame(curves);
	const { from, to, aMax } = frame;
	const px = (v: number) => pad.l + ((v - from) / (to - from)) * w;
	const pyA = (v: number) => pad.t + h - (Math.min(v, aMax) / aMax) * h;
	const py1 = (v: number) => pad.t + h - Math.max(0, Math.min(1, v)) * h;
	let k = 0;
	const paths = curves.series.map((s) => {
		const colour = s.kind === 'absorbance' ? SERIES_COLOURS.absorbance[k++ % SERIES_COLOURS.absorbance.length] : SERIES_COLOURS[s.kind];
		const pts: string[] = [];
		for (let i = 0; i < x.length; i++) if (x[i] >= from && x[i] <= to) pts.push(`${px(x[i]).toFixed(1)},${(s.kind === 'absorbance' ? pyA(s.y[i]) : py1(s.y[i])).toFixed(1)}`);
		const dash = s.kind === 'transmission' ? ' stroke-dasharray="6 3"' : '';
		return { colour, name: s.name, svg: `<polyline fill="none" stroke="${colour}" stroke-width="1.6"${dash} points="${pts.join(' ')}"/>` };
	});
	const ticks: string[] = [];
	for (const v of frame.nmTicks) ticks.push(`<line x1="${px(v)}" x2="${px(v)}" y1="${pad.t + h}" y2="${pad.t + h + 4}" stroke="#667ba4"/><text x="${px(v)}" y="${pad.t + h + 16}" text-anchor="middle">${v}</text>`);
	for (let i = 0; i <= 4; i++) {
		const a = frame.aTicks[i];
		ticks.push(`<text x="${pad.l - 6}" y="${pyA(a) + 4}" text-anchor="end">${Number(a.toFixed(2))}</text><text x="${pad.l + w + 6}" y="${py1(i / 4) + 4}">${i / 4}</text>`);
	}
	const legend = paths.map((p) => `<span class="key"><i style="background:${p.colour}"></i>${esc(p.name)}</span>`).join('');
	return `<figure class="overlay"><svg viewBox="0 0 ${width} ${height}" role="img" aria-label="Overlay of absorbance, wall transmission and lamp emission against wavelength">
<rect x="${pad.l}" y="${pad.t}" width="${w}" height="${h}" fill="#fff" stroke="#b3bfd4"/>${paths.map((p) => p.svg).join('')}${ticks.join('')}
<text x="${pad.l + w / 2}" y="${height - 4}" text-anchor="middle">wavelength / nm</text>
<text transform="translate(12 ${pad.t + h / 2}) rotate(-90)" text-anchor="middle">absorbance over the path</text>
<text transform="translate(${width - 8} ${pad.t + h / 2}) rotate(90)" text-anchor="middle">transmission, relative emission</text></svg>
<figcaption>${legend}${frame.clipped ? `<span class="note">${esc(clippedNote(frame))}</span>` : ''}</figcaption></figure>`;
}

const CSS = `
body{font:14px/1.45 system-ui,-apple-system,"Segoe UI",sans-serif;color:#1b2436;background:#f7f4ec;margin:0}
main{max-width:52rem;margin:0 auto;padding:1.5rem 1.25rem 3rem;background:#fff}
h1{font-size:1.5rem;margin:.2rem 0}h2{font-size:1.1rem;margin:1.4rem 0 .4rem;border-bottom:1px solid #ddd4c0;padding-bottom:.2rem}
.sub{color:#3b4b6c;margin:0}.status{display:inline-block;margin:.4rem 0;padding:.1rem .5rem;border-radius:4px;background:#efe9db}
.status.approved{background:#dcefd8;color:#336529}
table{border-collapse:collapse;width:100%}th,td{text-align:left;vertical-align:top;padding:.3rem .4rem;border-bottom:1px solid #efe9db}
th{width:36%;font-weight:600;color:#2e3b56}td.missing{color:#8f2f1c;font-style:italic}
.methods{background:#eef1f6;padding:.7rem .9rem;border-radius:4px}
.caution{border-left:4px solid #8c9dbd;padding:.35rem .7rem;margin:.4rem 0}.caution.danger{border-color:#c4492f;background:#f8dcd5}
.caution.warning{border-color:#e9a23b;background:#fdf6e7}.caution p{margin:.15rem 0}.src{color:#4c5f87;font-size:12px}
.deferral{border:2px solid #1b2436;padding:.6rem .8rem;margin-top:.8rem;font-weight:600}
figure.overlay{margin:.5rem 0}figure svg{width:100%;height:auto;font-size:11px;fill:#2e3b56}
figcaption{display:flex;flex-wrap:wrap;gap:.3rem 1rem;font-size:12px}figcaption .note{flex-basis:100%;color:#3b4b6c}.key i{display:inline-block;width:14px;height:3px;margin-right:5px;vertical-align:middle}
.tools{display:flex;gap:1rem;margin-bottom:.6rem;font-size:13px}.note{color:#4c5f87;font-size:12px}
@media (max-width:600px){th{width:42%}main{padding:1rem .7rem}}
@media print{body{background:#fff}main{max-width:none;padding:0}.tools{display:none}h2{break-after:avoid}tr,.caution,.deferral,figure{break-inside:avoid}a{color:inherit;text-decoration:none}
@page{margin:16mm 14mm}}
`;

/** The standalone HTML document. `links` are shown on screen only (hidden when printed). */
export function renderPlanReportHtml(r: PlanReport, links: { plan: string; pdf: string }): string {
	const rows = r.checklist.map((c) => `<tr><th scope="row">${esc(c.label)}</th><td${c.recorded ? '' : ' class="missing"'}>${esc(c.value)}</td></tr>`).join('\n');
	const cautions = r.cautions
		.map((c) => `<div class="caution ${esc(c.severity)}"><p><strong>${esc(c.title)}</strong>${c.band ? ` (${esc(c.band)})` : ''}</p><p>${esc(c.text)}</p><p class="src">Source: ${esc(c.source)}</p></div>`)
		.join('\n');
	return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(r.heading)} — irradiation plan report</title><style>${CSS}</style></head>
<body><main>
<nav class="tools" aria-label="Report tools"><a href="${esc(links.plan)}">← Back to the plan</a><a href="${esc(links.pdf)}">Download PDF</a><span>Print this page for a paper copy (the links are left out).</span></nav>
<h1>${esc(r.heading)}</h1>
<p class="sub">${esc(r.subtitle)}</p>
<p class="status${r.status.startsWith('Approved') ? ' approved' : ''}" data-testid="report-status">${esc(r.status)}</p>
<h2>Reporting checklist</h2>
<table aria-label="Reporting checklist"><tbody>
${rows}
</tbody></table>
<h2>Spectra of the plan</h2>
${r.curves ? overlaySvg(r.curves) : '<p class="note">The plan holds no curves.</p>'}
<p class="note">${esc(r.modelNote)}</p>
<h2>Methods paragraph</h2>
<p class="methods" data-testid="methods">${esc(r.methods)}</p>
<h2>Safety</h2>
${r.safetyMeasures ? `<p><strong>Safety measures planned:</strong> ${esc(r.safetyMeasures)}</p>` : '<p class="missing">No safety measures recorded in this plan.</p>'}
${cautions}
<p class="deferral" data-testid="deferral">${esc(r.deferral)}</p>
</main></body></html>`;
}

/**
 * The PDF report, drawn with pdfkit (pure JavaScript; no browser at run time). DejaVu Sans (from the
 * dejavu-fonts-ttf package) is embedded so ε, Φ, λ, ×, ⁻ and µ print as written. Same content as the HTML report.
 */
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import type { PlanReport } from './planReport';
import { SERIES_COLOURS } from './planReportHtml';
import { clippedNote, overlayFrame } from './planReportPlot';

const require = createRequire(import.meta.url);
const FONT = require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf');
const FONT_BOLD = require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf');

const INK = '#1b2436', MUTED = '#4c5f87', LINE = '#ddd4c0', MISSING = '#8f2f1c';

/** Renders the report to a PDF buffer. */
export function renderPlanReportPdf(r: PlanReport): Promise<Buffer> {
	const doc = new PDFDocument({ size: 'A4', margins: { top: 50, bottom: 50, left: 50, right: 50 }, info: { Title: `${r.heading} — irradiation plan report`, Author: 'Windowsill', Subject: 'Irradiation plan report' } });
	doc.registerFont('body', FONT);
	doc.registerFont('bold', FONT_BOLD);
	const chunks: Buffer[] = [];
	doc.on('data', (c: Buffer) => chunks.push(c));
	const done = new Promise<Buffer>((resolve, reject) => {
		doc.on('end', () => resolve(Buffer.concat(chunks)));
		doc.on('error', reject);
	});
	const left = doc.page.margins.left;
	const width = doc.page.width - left - doc.page.margins.right;
	const heading = (t: string) => {
		if (doc.y > doc.page.height - 120) doc.addPage();
		doc.moveDown(0.8).font('bold').fontSize(12).fillColor(INK).text(t, left, doc.y);
		doc.moveTo(left, doc.y + 2).lineTo(left + width, doc.y + 2).strokeColor(LINE).lineWidth(0.8).stroke();
		doc.moveDown(0.4);
	};

	doc.font('bold').fontSize(17).fillColor(INK).text(r.heading);
	doc.font('body').fontSize(9.5).fillColor(MUTED).text(r.subtitle);
	doc.moveDown(0.3).font('bold').fontSize(10).fillColor(r.status.startsWith('Approved') ? '#336529' : INK).text(r.status);

	heading('Reporting checklist');
	const labelW = width * 0.36;
	for (const c of r.checklist) {
		const y = doc.y;
		doc.font('bold').fontSize(9).fillColor(INK);
		const hL = doc.heightOfString(c.label, { width: labelW - 8 });
		doc.font('body');
		const hV = doc.heightOfString(c.value, { width: width - labelW });
		if (y + Math.max(hL, hV) > doc.page.height - doc.page.margins.bottom) doc.addPage();
		const top = doc.y;
		doc.font('bold').fillColor(INK).text(c.label, left, top, { width: labelW - 8 });
		doc.font('body').fillColor(c.recorded ? INK : MISSING).text(c.value, left + labelW, top, { width: width - labelW });
		doc.y = top + Math.max(hL, hV) + 3;
		doc.moveTo(left, doc.y - 1).lineTo(left + width, doc.y - 1).strokeColor('#efe9db').lineWidth(0.5).stroke();
	}

	if (r.curves) {
		heading('Spectra of the plan');
		drawOverlay(doc, r.curves, left, width);
	}
	doc.font('body').fontSize(8.5).fillColor(MUTED).text(r.modelNote, left, doc.y, { width });

	heading('Methods paragraph');
	doc.font('body').fontSize(9.5).fillColor(INK).text(r.methods, left, doc.y, { width, align: 'left' });

	heading('Safety');
	doc.font('body').fontSize(9.5).fillColor(r.safetyMeasures ? INK : MISSING).text(r.safetyMeasures ? `Safety measures planned: ${r.safetyMeasures}` : 'No safety measures recorded in this plan.', left, doc.y, { width });
	for (const c of r.cautions) {
		doc.moveDown(0.3);
		if (doc.y > doc.page.height - 110) doc.addPage();
		doc.font('bold').fontSize(9.5).fillColor(c.severity === 'danger' ? MISSING : INK).text(`${c.title}${c.band ? ` (${c.band})` : ''}`, left, doc.y, { width });
		doc.font('body').fontSize(9).fillColor(INK).text(c.text, { width });
		doc.fontSize(8).fillColor(MUTED).text(`Source: ${c.source}`, { width });
	}
	doc.moveDown(0.6);
	if (doc.y > doc.page.height - 110) doc.addPage();
	const boxTop = doc.y;
	doc.font('bold').fontSize(10).fillColor(INK);
	const h = doc.heightOfString(r.deferral, { width: width - 16 });
	doc.rect(left, boxTop, width, h + 14).lineWidth(1.5).strokeColor(INK).stroke();
	doc.text(r.deferral, left + 8, boxTop + 7, { width: width - 16 });
	doc.end();
	return done;
}

/** The overlay as vector lines: absorbance (left axis) and transmission / relative emission 0–1 (right axis). */
function drawOverlay(doc: PDFKit.PDFDocument, curves: NonNullable<PlanReport['curves']>, left: number, width: number) {
	const height = 170;
	if (doc.y + height + 50 > doc.page.height - doc.page.margins.bottom) doc.addPage();
	const top = doc.y + 4;
	const pl = left + 34, pw = width - 68, ph = height - 26;
	const x = curves.x;
	const frame = overlayFrame(curves);
	const { from, to, aMax } = frame;
	const px = (v: number) => pl + ((v - from) / (to - from)) * pw;
	const pyA = (v: number) => top + ph - (Math.min(v, aMax) / aMax) * ph;
	const py1 = (v: number) => top + ph - Math.max(0, Math.min(1, v)) * ph;
	doc.rect(pl, top, pw, ph).lineWidth(0.6).strokeColor('#b3bfd4').stroke();
	doc.font('body').fontSize(7).fillColor(MUTED);
	for (const v of frame.nmTicks) doc.text(String(v), px(v) - 12, top + ph + 3, { width: 24, align: 'center', lineBreak: false });
	for (let i = 0; i <= 4; i++) {
		doc.text(String(Number(frame.aTicks[i].toFixed(2))), pl - 30, pyA(frame.aTicks[i]) - 3, { width: 26, align: 'right', lineBreak: false });
		doc.text(String(i / 4), pl + pw + 4, py1(i / 4) - 3, { width: 26, lineBreak: false });
	}
	doc.text('wavelength / nm', pl, top + ph + 13, { width: pw, align: 'center', lineBreak: false });
	let k = 0;
	const legend: { name: string; colour: string }[] = [];
	for (const s of curves.series) {
		const colour = s.kind === 'absorbance' ? SERIES_COLOURS.absorbance[k++ % SERIES_COLOURS.absorbance.length] : SERIES_COLOURS[s.kind];
		let started = false;
		for (let i = 0; i < x.length; i++) {
			if (x[i] < from || x[i] > to) continue;
			const yy = s.kind === 'absorbance' ? pyA(s.y[i]) : py1(s.y[i]);
			if (!started) doc.moveTo(px(x[i]), yy);
			else doc.lineTo(px(x[i]), yy);
			started = true;
		}
		if (s.kind === 'transmission') doc.dash(4, { space: 2 });
		doc.lineWidth(1.1).strokeColor(colour).stroke();
		doc.undash();
		legend.push({ name: s.name, colour });
	}
	doc.y = top + height;
	let lx = left;
	doc.fontSize(7.5);
	for (const l of legend) {
		const w = doc.widthOfString(l.name) + 26;
		if (lx + w > left + width) {
			lx = left;
			doc.y += 11;
		}
		doc.rect(lx, doc.y + 3, 12, 2.5).fill(l.colour);
		doc.fillColor(INK).text(l.name, lx + 16, doc.y, { lineBreak: false });
		lx += w;
	}
	doc.y += 16;
	if (frame.clipped) {
		doc.font('body').fontSize(7.5).fillColor(MUTED).text(clippedNote(frame), left, doc.y, { width });
		doc.moveDown(0.5);
	}
	doc.x = left;
}

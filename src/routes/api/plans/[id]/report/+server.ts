import { ApiError, apiHandler } from '$lib/server/http';
import { planReportFor } from '$lib/server/services/planReportSource';
import { renderPlanReportHtml } from '$lib/server/services/planReportHtml';
import { renderPlanReportPdf } from '$lib/server/services/planReportPdf';
import type { RequestHandler } from './$types';

/**
 * GET /api/plans/:id/report `?format=pdf|html&revision=` — viewer+ of the plan's group: the printable report (HTML,
 * the default) or the PDF (`application/pdf`, as a download).
 */
export const GET: RequestHandler = apiHandler(async ({ locals, params, url }) => {
	const format = url.searchParams.get('format') ?? 'html';
	if (format !== 'pdf' && format !== 'html') throw new ApiError(400, 'invalid', 'format: pdf or html.', { field: 'format' });
	const { report, planId, fileName } = await planReportFor(locals, params.id, url.searchParams.get('revision'));
	if (format === 'pdf') {
		const pdf = await renderPlanReportPdf(report);
		return new Response(new Uint8Array(pdf), { headers: { 'content-type': 'application/pdf', 'content-disposition': `attachment; filename="${fileName}.pdf"`, 'cache-control': 'private, no-store' } });
	}
	const rev = url.searchParams.get('revision');
	const html = renderPlanReportHtml(report, { plan: `/plans/${planId}`, pdf: `/api/plans/${planId}/report?format=pdf${rev ? `&revision=${encodeURIComponent(rev)}` : ''}` });
	return new Response(html, { headers: { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'private, no-store' } });
});

/**
 * POST /api/materials/optical-constants: a group's own wall material from an uploaded n, k table (wavelength, n, k as
 * delimited text) or a refractive-index database file (YAML: tabulated n, k or a dispersion formula for n with
 * tabulated k; irradiation/refractiveIndexYaml.ts — negative k refused, an implausible window warned). The material uses the tabulated-k model of ../../irradiation/walls.ts,
 * T = (1 − R)²·exp(−4πk·d/λ), R = ((n − 1)/(n + 1))², with n at 589.3 nm for the Fresnel loss. Writes nothing on bad input.
 */
import { getWallMaterial, insertWallMaterial } from '$lib/server/db/wallMaterials';
import { ApiError } from '$lib/server/http';
import { decodeText, refractiveIndexYaml } from '$lib/spectra/parse/index';
import { parseRefractiveIndexYaml } from '$lib/irradiation/refractiveIndexYaml';
import { readOpticalConstantsTable } from '$lib/spectra/parse/csvOpticalConstants';
import { groupForNewRow, requireMemberSomewhere } from './groupChoice';
import { issuesToApiError, uploadLimitBytes } from './spectraPrepare';

function tableFromDelimited(filename: string, text: string) {
	const r = readOpticalConstantsTable(text);
	if (!r.ok) throw issuesToApiError(filename, r.issues);
	return r.value;
}

/** n at 589.3 nm (sodium D line, common practice; the nearest end of the n range outside it) and the tabulated k. */
function tableFromYaml(filename: string, text: string) {
	const r = parseRefractiveIndexYaml(text);
	if (!r.ok) throw issuesToApiError(filename, r.issues);
	const c = r.value;
	if (!c.kTable || !c.kTable.wavelengthNm.length)
		throw new ApiError(422, 'physically_invalid', `file: ${filename} gives the refractive index n only, no extinction coefficient k; a wall's transmission needs k (its absorption) — upload a file with tabulated k`, { field: 'file' });
	return { wavelengthNm: c.kTable.wavelengthNm, k: c.kTable.k, nForFresnel: c.n(589.3), warnings: r.warnings.map(({ code, message, line }) => ({ code, message, line })) };
}

export async function addWallMaterialFromOpticalConstants(locals: App.Locals, form: FormData) {
	await requireMemberSomewhere(locals);
	const file = form.get('file');
	if (!(file instanceof Blob)) throw new ApiError(400, 'invalid', 'file: attach the n, k table as multipart field "file"', { field: 'file' });
	const filename = (file as File).name || 'optical-constants';
	const name = String(form.get('name') ?? '').trim();
	if (!name || name.length > 160) throw new ApiError(400, 'invalid', 'name: give the material a name (at most 160 characters)', { field: 'name' });
	const thickness = Number(String(form.get('thicknessMm') ?? '').replace(',', '.'));
	if (!(thickness > 0 && thickness <= 100)) throw new ApiError(422, 'physically_invalid', 'thicknessMm: the typical wall thickness must be above 0 and at most 100 mm', { field: 'thicknessMm' });
	if (file.size > uploadLimitBytes()) throw new ApiError(413, 'too_large', `${filename}: above the upload limit`, { field: 'file' });
	const text = decodeText(new Uint8Array(await file.arrayBuffer()));
	if (text === undefined) throw new ApiError(415, 'unsupported_file', `${filename}: binary content; upload the n, k table as delimited text`, { field: 'file' });
	const t = refractiveIndexYaml(text) ? tableFromYaml(filename, text) : tableFromDelimited(filename, text);
	const groupId = await groupForNewRow(locals);
	const slug = `group-${groupId}-${name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}-${Date.now().toString(36)}`.slice(0, 80);
	const id = await insertWallMaterial({
		slug,
		name,
		model: { model: 'k', kTable: { wavelengthNm: t.wavelengthNm, k: t.k }, n: t.nForFresnel },
		refractiveIndex: t.nForFresnel,
		typicalThicknessMm: thickness,
		source: `optical constants n, k uploaded by the group: “${filename.slice(0, 120)}”, ${t.wavelengthNm.length} wavelengths ${Math.round(t.wavelengthNm[0])}–${Math.round(t.wavelengthNm[t.wavelengthNm.length - 1])} nm`,
		status: 'measured',
		notes: `n = ${t.nForFresnel.toFixed(4)} (at 589.3 nm, or the median of the table) used for the reflection loss at both faces.`,
		groupId,
		spectrumId: null,
		createdBy: locals.user!.id
	});
	const m = (await getWallMaterial(id, [groupId]))!;
	return { id: m.id, slug: m.slug, name: m.name, source: m.source, status: m.status, typicalThicknessMm: thickness, refractiveIndex: t.nForFresnel, groupId, points: t.wavelengthNm.length, warnings: 'warnings' in t ? t.warnings : [] };
}

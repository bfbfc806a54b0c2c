/**
 * JCAMP-DX exports over HTTP, read back by jcampconverter (a general-purpose JCAMP-DX reader): a single spectrum is
 * ##XYDATA=(X++(Y..Y)) (not a peak table) with the points of GET …/data; two spectra are one LINK file of two blocks.
 */
import { convert } from 'jcampconverter';
import { expect, test } from '@playwright/test';
import { bearerContext } from './helpers/auth';

type Read = { flatten: { spectra: { data: { x: number[]; y: number[] }; isPeaktable?: boolean }[] }[] };

test('single and LINK JCAMP-DX exports read back with the stored points', async () => {
	const api = await bearerContext('member');
	const list = await (await api.get('/api/spectra?limit=2&part=substrate')).json();
	const ids: number[] = list.items.map((i: { id: number }) => i.id);
	expect(ids.length).toBe(2);
	const data = await Promise.all(ids.map(async (id) => (await api.get(`/api/spectra/${id}/data`)).json()));
	const one = await api.get(`/api/spectra/${ids[0]}/export?format=jcamp`);
	expect(one.status()).toBe(200);
	const text = await one.text();
	const uniform = /##XYDATA=\(X\+\+\(Y\.\.Y\)\)/.test(text);
	expect(text).not.toMatch(/##PEAK TABLE/);
	const link = await api.get(`/api/spectra/export?ids=${ids.join(',')}&format=jcamp`);
	expect(link.status()).toBe(200);
	const linkText = await link.text();
	expect(linkText).toMatch(/##DATA TYPE=LINK\n##BLOCKS=2/);
	if (uniform) {
		const blocks = (convert(linkText, { keepRecordsRegExp: /.*/ }) as unknown as Read).flatten.filter((f) => f.spectra?.length);
		expect(blocks).toHaveLength(2);
		blocks.forEach((b, k) => {
			const got = b.spectra[0].data;
			expect(got.x.length).toBe(data[k].x.length);
			const max = Math.max(...data[k].y.map(Math.abs));
			for (let i = 0; i < got.x.length; i += 17) {
				expect(Math.abs(got.x[i] - data[k].x[i])).toBeLessThan(1e-9 * data[k].x[i]);
				expect(Math.abs(got.y[i] - data[k].y[i])).toBeLessThanOrEqual(1e-12 * max + 1e-9 * Math.abs(data[k].y[i]));
			}
		});
	}
	expect((await api.get('/api/spectra/export?ids=1,abc&format=jcamp')).status()).toBe(400);
	expect((await api.get('/api/spectra/export?ids=999999999&format=jcamp')).status()).toBe(404);
	await api.dispose();
});

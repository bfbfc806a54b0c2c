/**
 * Keeps the role × route matrix honest: every row names every actor, and every method of every
 * /api route in src/routes/api has at least one row. (The matrix itself runs over HTTP in
 * tests/e2e/role-matrix.e2e.ts against the built app.)
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { ACTORS, ROLE_MATRIX_ROWS } from './roleMatrix.rows';

function serverFiles(dir: string): string[] {
	return readdirSync(dir).flatMap((n) => {
		const p = join(dir, n);
		return statSync(p).isDirectory() ? serverFiles(p) : n === '+server.ts' ? [p] : [];
	});
}

const apiRoot = join(process.cwd(), 'src', 'routes', 'api');
const endpoints = serverFiles(apiRoot).flatMap((file) => {
	const route = '/api/' + relative(apiRoot, file).split(sep).slice(0, -1).join('/');
	const pattern = new RegExp('^' + route.replace(/\/$/, '').replace(/\[\.\.\.[^\]]+\]/g, '.+').replace(/\[[^\]]+\]/g, '[^/]+') + '$');
	const src = readFileSync(file, 'utf8');
	const methods = [...src.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]);
	return methods.map((method) => ({ route, method, pattern }));
});

describe('role matrix rows', () => {
	it('every row states a status for every actor', () => {
		for (const row of ROLE_MATRIX_ROWS) expect(Object.keys(row.expect).sort(), row.name).toEqual([...ACTORS].sort());
	});
	it('every /api route method has at least one row', () => {
		const missing = endpoints.filter((e) => !ROLE_MATRIX_ROWS.some((r) => r.method === e.method && e.pattern.test(r.path.split('?')[0])));
		expect(missing.map((m) => `${m.method} ${m.route}`)).toEqual([]);
	});
});

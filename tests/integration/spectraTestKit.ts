/**
 * Set-up shared by the spectra integration tests: two throw-away groups and their members in the
 * real test database (ids prefixed `spx-` so the tests never touch demo rows), `locals` for each,
 * and helpers to upload through the same service the API uses.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { db } from '../../src/lib/server/db/index';
import { uploadSpectrumFile } from '../../src/lib/server/services/spectraUpload';
import type { storeSpectra } from '../../src/lib/server/services/spectraStore';
import type { SessionUser } from '../../src/lib/server/auth/types';

export { externalPath as external } from '../../src/lib/spectra/__fixtures__/external';
export const fixture = (rel: string) => path.resolve(process.cwd(), 'fixtures/library', rel);

const people = ['lead', 'member', 'member2', 'viewer', 'outsider'] as const;
export type Who = (typeof people)[number];
const userId = (w: Who) => `spx-${w}`;

/** `locals` of a test user. */
export function localsOf(who: Who): App.Locals {
	const user: SessionUser = { id: userId(who), email: `${who}.spx@windowsill.test`, name: `Spx ${who}`, siteRole: 'user', emailVerified: true };
	return { user, session: null } as App.Locals;
}

/** Creates (or resets) group A (lead, member, member2, viewer) and group B (outsider) with no spectra. */
export async function resetSpectraWorld(): Promise<{ groupA: number; groupB: number }> {
	const k = db();
	await k('spectra').whereIn('owner_id', people.map(userId)).delete();
	for (const w of people) await k('users').insert({ id: userId(w), email: `${w}.spx@windowsill.test`, name: `Spx ${w}`, password_hash: 'x', email_verified: true }).onConflict('id').ignore();
	for (const slug of ['spx-a', 'spx-b']) await k('groups').insert({ name: `Spx group ${slug}`, slug }).onConflict('slug').ignore();
	const groupA = Number((await k('groups').where({ slug: 'spx-a' }).first('id')).id);
	const groupB = Number((await k('groups').where({ slug: 'spx-b' }).first('id')).id);
	await k('spectra').whereIn('group_id', [groupA, groupB]).delete();
	await k('memberships').whereIn('user_id', people.map(userId)).delete();
	const roles: [Who, number, string][] = [['lead', groupA, 'lead'], ['member', groupA, 'member'], ['member2', groupA, 'member'], ['viewer', groupA, 'viewer'], ['outsider', groupB, 'member']];
	await k('memberships').insert(roles.map(([w, g, role]) => ({ user_id: userId(w), group_id: g, role })));
	return { groupA, groupB };
}

type Saved = Awaited<ReturnType<typeof storeSpectra>>;

/** Uploads bytes as `who` through the API's service (`preview` = parse only: the answer then has `preview`, not `items`). */
export function upload(who: Who, name: string, bytes: Uint8Array | string, metadata: Record<string, unknown> = {}, preview = false): Promise<Saved> {
	const file = new File([(typeof bytes === 'string' ? new TextEncoder().encode(bytes) : bytes) as BlobPart], name);
	return uploadSpectrumFile(localsOf(who), file, JSON.stringify(metadata), preview) as Promise<Saved>;
}

/** Uploads a file from disk. */
export const uploadPath = (who: Who, p: string, metadata: Record<string, unknown> = {}) => upload(who, path.basename(p), readFileSync(p), metadata);

/** Number of rows in the spectra family of tables. */
export async function rowCounts() {
	const k = db();
	const n = async (t: string) => Number((await k(t).count({ n: '*' }))[0].n);
	return { spectra: await n('spectra'), revisions: await n('spectrum_revisions'), tags: await n('spectrum_tags') };
}

/** Awaits a promise that must fail with an ApiError; returns it. */
export async function apiFailure(p: Promise<unknown>): Promise<{ status: number; code: string; message: string; extra: Record<string, unknown> }> {
	try {
		await p;
	} catch (e) {
		return e as never;
	}
	throw new Error('expected the call to fail');
}

/** Gaussian band, for invented test spectra (test data only). */
export const gauss = (x: number, centreNm: number, widthNm: number, height: number) => height * Math.exp(-0.5 * ((x - centreNm) / widthNm) ** 2);

/** CSV text of y(x) from fromNm to toNm at 1 nm. */
export function csvOf(header: string, f: (x: number) => number, fromNm = 250, toNm = 700): string {
	const rows = [header];
	for (let x = fromNm; x <= toNm; x++) rows.push(`${x},${f(x).toPrecision(8)}`);
	return rows.join('\n') + '\n';
}

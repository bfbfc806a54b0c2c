/**
 * Plans against the real test database with the demo group (seeded): saving with a decision and an idempotency key,
 * review with mail (caught by an in-process SMTP server), the thread, the self-approval rule, 409s on wrong state
 * and stale versions, audit entries, recompute with field differences and revisions, and the report (HTML and PDF).
 * Every plan this file makes is deleted afterwards.
 */
import { once } from 'node:events';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SMTPServer } from 'smtp-server';
import { PDFParse } from 'pdf-parse';
import { db } from '../../src/lib/server/db';
import { findLamp, updateLampIfVersion } from '../../src/lib/server/db/lamps';
import { ApiError } from '../../src/lib/server/http';
import { createPlan, patchPlan } from '../../src/lib/server/services/plans';
import { commentOnPlan, reviewPlan, submitPlan } from '../../src/lib/server/services/planReview';
import { recomputePlan } from '../../src/lib/server/services/planRecompute';
import { auditFor } from '../../src/lib/server/services/auditLog';
import { planReportFor } from '../../src/lib/server/services/planReportSource';
import { renderPlanReportHtml } from '../../src/lib/server/services/planReportHtml';
import { renderPlanReportPdf } from '../../src/lib/server/services/planReportPdf';
import { SAFETY_DEFERRAL_TEXT } from '../../src/lib/irradiation/cautions';
import type { SessionUser } from '../../src/lib/server/auth/types';

const demo = (id: string, siteRole: 'admin' | 'user' = 'user'): App.Locals => ({ user: { id, email: `${id}@windowsill.test`, name: id, siteRole, emailVerified: true } as SessionUser, session: null }) as App.Locals;
const member = demo('demo-member');
const lead = demo('demo-lead');
const lead2 = demo('demo-lead2');
const viewer = demo('demo-viewer');
const outsider = demo('demo-outsider');
const admin = demo('demo-admin', 'admin');
const ctx = { origin: 'http://127.0.0.1:9' };

const mail: { to: string; raw: string }[] = [];
let smtp: SMTPServer;
const made: number[] = [];
let groupId = 0;
let spectrumId = 0; // Morrow enone (demo substrate with ε)
let solventId = 0;
let wallId = 0;
const lampName = 'Bench LED 365 (array A)';
let lampId = 0;

async function rejects(p: Promise<unknown>): Promise<ApiError> {
	try {
		await p;
	} catch (e) {
		if (e instanceof ApiError) return e;
		throw e;
	}
	throw new Error('expected an ApiError');
}

const inputs = () => ({ substrate: { spectrumId, concentrationM: 0.02 }, solvent: { id: solventId }, wall: { materialId: wallId, thicknessMm: 2 }, pathCm: 1, quantumYield: 0.3, volumeL: 0.005 });
const mailTo = (addr: string) => mail.filter((m) => m.to.includes(addr));

beforeAll(async () => {
	smtp = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS', 'AUTH'],
		onData(stream, session, cb) {
			const chunks: Buffer[] = [];
			stream.on('data', (c: Buffer) => chunks.push(c));
			stream.on('end', () => {
				mail.push({ to: session.envelope.rcptTo.map((r) => r.address).join(','), raw: Buffer.concat(chunks).toString('utf8') });
				cb();
			});
		}
	});
	smtp.listen(0, '127.0.0.1');
	await once(smtp.server, 'listening');
	process.env.SMTP_PORT = String((smtp.server.address() as AddressInfo).port);
	delete process.env.SMTP_HOST;
	groupId = Number((await db()('groups').where({ slug: 'harbourlight' }).first('id')).id);
	spectrumId = Number((await db()('spectra').where({ name: 'Morrow enone', group_id: groupId }).first('id')).id);
	solventId = Number((await db()('solvents').where({ slug: 'dichloromethane' }).first('id')).id);
	wallId = Number((await db()('wall_materials').where({ slug: 'borosilicate-3.3-tubing' }).first('id')).id);
	lampId = Number((await db()('lamps').where({ name: lampName, group_id: groupId }).first('id')).id);
});

afterAll(async () => {
	if (made.length) await db()('plans').whereIn('id', made).del();
	await new Promise<void>((r) => smtp.close(() => r()));
});

describe('saving a plan', () => {
	it('records the decision, defaults the lamp to the best-ranked one, and one idempotency key makes one plan', async () => {
		const key = crypto.randomUUID();
		const body = { title: 'Morrow enone, UV-A', inputs: inputs(), idempotencyKey: key, decision: { irradiationTimeS: 3600, safetyMeasures: 'UV-blocking goggles; enclosure closed.' } };
		// A double submit: two requests with the same key at the same time.
		const [a, b] = await Promise.all([createPlan(member, body), createPlan(member, body)]);
		made.push(a.plan.id);
		expect(b.plan.id).toBe(a.plan.id);
		expect([a.created, b.created].sort()).toEqual([false, true]);
		expect(await db()('plans').where({ idempotency_key: key }).count('* as n').first()).toMatchObject({ n: 1 });
		const p = a.plan;
		const best = (p.results.lamps as { id: number }[])[0].id;
		expect(p.decision).toMatchObject({ lampId: best, wall: { materialId: wallId, thicknessMm: 2 }, solventId, pathCm: 1, irradiationTimeS: 3600 });
		expect(p.absorberSpectrumId).toBe(spectrumId);
		expect((p.results.decided as { cautions: { text: string }[] }).cautions.at(-1)?.text).toBe(SAFETY_DEFERRAL_TEXT);
	});

	it('refuses an impossible decision with 422 naming the field, and writes nothing', async () => {
		const before = await db()('plans').count('* as n').first();
		const e = await rejects(createPlan(member, { title: 'x', inputs: inputs(), decision: { lampId, pathCm: -1 } }));
		expect([e.status, e.extra.field]).toEqual([422, 'decision.pathCm']);
		const e2 = await rejects(createPlan(member, { title: 'x', inputs: inputs(), decision: { lampId: 999999 } }));
		expect([e2.status, e2.extra.field]).toEqual([422, 'decision.lampId']);
		const e3 = await rejects(createPlan(member, { title: 'x', inputs: inputs(), idempotencyKey: 'not-a-uuid' }));
		expect([e3.status, e3.extra.field]).toEqual([400, 'idempotencyKey']);
		expect(await db()('plans').count('* as n').first()).toEqual(before);
	});

	it('lets viewers read but not save', async () => {
		expect((await rejects(createPlan(viewer, { title: 'x', inputs: inputs() }))).status).toBe(403);
	});
});

describe('review', () => {
	let id = 0;
	beforeAll(async () => {
		const { plan } = await createPlan(member, { title: 'Review story plan', inputs: inputs(), decision: { lampId } });
		id = plan.id;
		made.push(id);
	});

	it('submit mails both leads, writes the audit log, and a second submit is a 409', async () => {
		mail.length = 0;
		const p = await submitPlan(member, String(id), {}, ctx);
		expect(p.state).toBe('submitted');
		expect(mailTo('lead@windowsill.test')).toHaveLength(1);
		expect(mailTo('lead2@windowsill.test')).toHaveLength(1);
		expect(mailTo('lead@windowsill.test')[0].raw).toContain(`/plans/${id}`);
		const e = await rejects(submitPlan(member, String(id), {}, ctx));
		expect([e.status, e.code]).toEqual([409, 'wrong_state']);
		const log = await auditFor(lead, { groupId: String(groupId), limit: '20' });
		expect(log.some((a) => a.action === 'plan.submit' && a.target === `plan:${id}`)).toBe(true);
	});

	it('outsiders get 404; members cannot review; a stale version is a 409; returning needs a comment', async () => {
		expect((await rejects(reviewPlan(outsider, String(id), {}, 'approved', ctx))).status).toBe(404);
		expect((await rejects(reviewPlan(member, String(id), {}, 'approved', ctx))).status).toBe(403);
		expect((await rejects(reviewPlan(lead, String(id), { version: 1 }, 'approved', ctx))).status).toBe(409);
		const e = await rejects(reviewPlan(lead, String(id), {}, 'returned', ctx));
		expect([e.status, e.extra.field]).toEqual([400, 'comment']);
	});

	it('return mails the author; the author replies in the thread, which mails the reviewer; edit with a stale version is a 409', async () => {
		mail.length = 0;
		const p = await reviewPlan(lead, String(id), { comment: 'Add the safety measures and the irradiation time.' }, 'returned', ctx);
		expect(p.state).toBe('returned');
		expect(mailTo('member@windowsill.test')[0].raw).toContain('Add the safety measures');
		await commentOnPlan(member, String(id), { body: 'Added both; goggles and an interlocked box.' }, ctx);
		expect(mailTo('lead@windowsill.test')).toHaveLength(1);
		expect((await rejects(commentOnPlan(viewer, String(id), { body: 'hi' }, ctx))).status).toBe(403);
		expect((await rejects(commentOnPlan(member, String(id), { body: '  ' }, ctx))).extra.field).toBe('body');
		expect((await rejects(patchPlan(member, String(id), { version: p.version - 1, decision: { irradiationTimeS: 5400 } }))).status).toBe(409);
		const edited = await patchPlan(member, String(id), { version: p.version, decision: { irradiationTimeS: 5400, safetyMeasures: 'UV goggles; interlocked enclosure.' } });
		expect(edited.decision).toMatchObject({ irradiationTimeS: 5400, lampId });
		const again = await submitPlan(member, String(id), { version: edited.version }, ctx);
		mail.length = 0;
		const ok = await reviewPlan(lead2, String(id), { version: again.version }, 'approved', ctx);
		expect(ok.state).toBe('approved');
		expect(ok.reviewerName).toBe('Dr. Maelis Orrin');
		expect(mailTo('member@windowsill.test')).toHaveLength(1);
		expect((await rejects(patchPlan(member, String(id), { version: ok.version, title: 'changed' }))).status).toBe(409);
	});

	it('a lead cannot approve a plan they wrote; another lead can, and so can an admin', async () => {
		const { plan } = await createPlan(lead, { title: 'Lead-authored plan', inputs: inputs(), decision: { lampId } });
		made.push(plan.id);
		await submitPlan(lead, String(plan.id), {}, ctx);
		const e = await rejects(reviewPlan(lead, String(plan.id), {}, 'approved', ctx));
		expect(e.status).toBe(403);
		expect((await reviewPlan(admin, String(plan.id), {}, 'approved', ctx)).state).toBe('approved');
	});
});

describe('recompute and report', () => {
	it('lists field changes after a lamp changes, saves a new revision, and keeps the approved one', async () => {
		const { plan } = await createPlan(member, { title: 'Recompute plan', inputs: inputs(), decision: { lampId, irradiationTimeS: 1800 } });
		made.push(plan.id);
		await submitPlan(member, String(plan.id), {}, ctx);
		const approved = await reviewPlan(lead, String(plan.id), {}, 'approved', ctx);
		expect((await recomputePlan(member, String(plan.id), {})).changes).toEqual([]);
		const lamp = (await findLamp(lampId))!;
		try {
			await updateLampIfVersion(lampId, lamp.version, { powerW: lamp.powerW * 2 });
			const out = await recomputePlan(member, String(plan.id), {});
			const flux = out.changes.find((c) => c.field === 'decided.incidentPhotonFluxEinsteinPerS')!;
			// Photon flux is linear in optical power, q = P·λ/(h·c·N_A) (CODATA 2018 constants): doubling P doubles q.
			expect(Number(flux.after) / Number(flux.before)).toBeCloseTo(2, 6);
			expect((await rejects(recomputePlan(member, String(plan.id), { save: true }))).extra.field).toBe('version');
			expect((await rejects(recomputePlan(viewer, String(plan.id), {}))).status).toBe(403);
			const saved = await recomputePlan(member, String(plan.id), { save: true, version: approved.version });
			expect(saved.saved).toBe(true);
			expect(saved.revision).toBe(2);
			expect(saved.plan.state).toBe('draft');
			const first = await planReportFor(member, String(plan.id), '1');
			expect(first.report.status).toMatch(/^Approved/);
		} finally {
			const now = (await findLamp(lampId))!;
			await updateLampIfVersion(lampId, now.version, { powerW: lamp.powerW });
		}
	});

	it('the report names the lamp, the photon flux basis and the safety deferral, in HTML and in the PDF text', async () => {
		const { plan } = await createPlan(member, { title: 'Report plan', inputs: inputs(), decision: { lampId, irradiationTimeS: 7200, safetyMeasures: 'Enclosure closed while the lamp is on.', temperatureC: 20 } });
		made.push(plan.id);
		const { report } = await planReportFor(viewer, String(plan.id), null);
		const labels = report.checklist.map((c) => c.label);
		// Reporting checklist items (Bonfield et al., Nat. Commun. 11, 804 (2020); REFERENCE.md §8).
		for (const l of ['Light source', 'Emission spectrum', 'Photon flux into the vessel and its basis', 'Distance and geometry', 'Vessel material and wall thickness', 'Fill volume', 'Solvent', 'Concentrations', 'Temperature of the mixture (measured, not the set-point)', 'Quantum yield Φ', 'Irradiation time']) expect(labels).toContain(l);
		expect(report.checklist.find((c) => c.label === 'Fill volume')?.value).toBe('5 mL');
		expect(report.methods).toContain(lampName);
		expect(report.methods).toContain('2.0 h');
		const html = renderPlanReportHtml(report, { plan: '/plans/1', pdf: '/x' });
		expect(html).toContain(lampName);
		expect(html).toContain('model: emission model');
		expect(html).toContain('institutional safety officer');
		const pdf = await renderPlanReportPdf(report);
		expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
		const text = (await new PDFParse({ data: new Uint8Array(pdf) }).getText()).text.replace(/\s+/g, ' ');
		expect(text).toContain(lampName);
		expect(text).toContain('Photon flux into the vessel and its basis');
		expect(text).toContain('model: emission model × optical power × coupling factor');
		expect(text).toContain('Consult your institutional safety officer before operating any light source.');
		expect((await rejects(planReportFor(outsider, String(plan.id), null))).status).toBe(404);
	});
});

describe('audit log access', () => {
	it('leads read their group, admins everything, members and outsiders nothing', async () => {
		expect((await auditFor(admin, {})).length).toBeGreaterThan(0);
		expect((await rejects(auditFor(member, { groupId: String(groupId) }))).status).toBe(403);
		expect((await rejects(auditFor(outsider, { groupId: String(groupId) }))).status).toBe(404);
		expect((await rejects(auditFor(lead, { limit: '0' }))).extra.field).toBe('limit');
		const mine = await auditFor(lead, {});
		expect(mine.every((e) => e.groupId === groupId)).toBe(true);
	});
});

import type { Knex } from 'knex';

/**
 * The demo group's lamps (invented; demo mode only). Models use the generic emission models of
 * src/lib/irradiation/lamps.ts; powers are optical watts. Upserts by (group, name).
 */
const DEMO_LAMPS = [
	{ name: 'Bench LED 365 (array A)', powerW: 3.2, couplingFactor: 0.6, distance: '2 cm from a 10 mL vial, behind a reflector sleeve', exposureCm: 50, model: { type: 'led', peakNm: 365, fwhmNm: 10, shape: 'gaussian' } },
	{ name: 'Violet LED 390 (fan-cooled)', powerW: 2.5, couplingFactor: 0.55, distance: '3 cm, side-on', model: { type: 'led', peakNm: 390, fwhmNm: 12, shape: 'ohno' } },
	{ name: 'Violet LED 405 strip', powerW: 1.6, couplingFactor: 0.5, distance: 'wrapped round a 25 mL flask', model: { type: 'led', peakNm: 405, fwhmNm: 14, shape: 'gaussian' } },
	{ name: 'Blue LED 450 photoreactor ring', powerW: 8, couplingFactor: 0.7, distance: 'ring of 12 LEDs, 1.5 cm to the vial wall', model: { type: 'led', peakNm: 450, fwhmNm: 20, shape: 'ohno' } },
	{ name: 'Green LED 525 panel', powerW: 2, couplingFactor: 0.45, distance: '4 cm', model: { type: 'led', peakNm: 525, fwhmNm: 32, shape: 'gaussian' } },
	{ name: 'Low-pressure mercury pencil (ozone-free)', powerW: 0.8, couplingFactor: 0.4, distance: 'immersion well, 1 cm annulus', model: { type: 'mercury-low-pressure', ozoneFree: true } },
	{ name: 'Medium-pressure mercury immersion lamp', powerW: 60, couplingFactor: 0.5, distance: 'water-cooled immersion well', model: { type: 'mercury-medium-pressure' } },
	{ name: 'UV-A phosphor tube bank (350 nm)', powerW: 6, couplingFactor: 0.3, distance: 'carousel of 8 tubes, 10 cm', exposureCm: 100, exposureWPerM2: 0.9, model: { type: 'phosphor', peakNm: 352, fwhmNm: 40, mercuryLines: true } }
];

const demoMode = () => process.env.NODE_ENV !== 'production' || process.env.WINDOWSILL_DEMO === '1';

export async function seed(knex: Knex): Promise<void> {
	if (!demoMode()) return;
	const group = await knex('groups').where({ slug: 'harbourlight' }).first();
	if (!group) return;
	const owner = await knex('users').where({ email: 'lead@windowsill.test' }).first();
	for (const l of DEMO_LAMPS) {
		const row = {
			group_id: group.id,
			owner_id: owner?.id ?? null,
			name: l.name,
			model: JSON.stringify(l.model),
			power_w: l.powerW,
			coupling_factor: l.couplingFactor,
			distance_note: l.distance,
			// where the operator stands (invented); the tube bank also has an (invented) radiometer reading there
			exposure_distance_cm: 'exposureCm' in l ? l.exposureCm : null,
			exposure_irradiance_w_m2: 'exposureWPerM2' in l ? l.exposureWPerM2 : null,
			notes: 'Demo lamp of an invented group.'
		};
		await knex('lamps').insert(row).onConflict(['group_id', 'name']).merge(['model', 'power_w', 'coupling_factor', 'distance_note', 'exposure_distance_cm', 'exposure_irradiance_w_m2']);
	}
}

import Fuse from 'fuse.js';

/** The fields a solvent is found by. */
export interface SolventSearchable {
	name: string;
	synonyms: string[];
	cas: string | null;
}

/**
 * fuse.js over solvent names (weight 0.6), synonyms/abbreviations (0.3) and CAS numbers (0.1); ignoreLocation so
 * "aceto" matches inside a name, threshold 0.35. Shared by /api/solvents and the solvents page.
 */
export function createSolventFuse<T extends SolventSearchable>(list: readonly T[]): Fuse<T> {
	return new Fuse(list, {
		keys: [
			{ name: 'name', weight: 0.6 },
			{ name: 'synonyms', weight: 0.3 },
			{ name: 'cas', weight: 0.1 }
		],
		ignoreLocation: true,
		threshold: 0.35
	});
}

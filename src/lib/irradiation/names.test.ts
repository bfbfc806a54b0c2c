import { describe, expect, it } from 'vitest';
import { nameInSentence } from './names';

describe('names inside sentences', () => {
	it('lower-cases an ordinary capitalised first word and keeps acronyms', () => {
		expect(nameInSentence('Medium-pressure mercury immersion lamp')).toBe('medium-pressure mercury immersion lamp');
		expect(nameInSentence('Bench LED 365 (array A)')).toBe('bench LED 365 (array A)');
		expect(nameInSentence('UV-A phosphor tube bank')).toBe('UV-A phosphor tube bank');
		expect(nameInSentence('LED 390')).toBe('LED 390');
		expect(nameInSentence('390 nm LED')).toBe('390 nm LED');
	});
});

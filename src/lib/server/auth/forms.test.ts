import { describe, expect, it } from 'vitest';
import { safeNext } from './forms';

// Open-redirect payloads: OWASP "Unvalidated Redirects and Forwards Cheat Sheet" and the common
// bypass lists (double slashes, backslashes, tabs/newlines browsers strip, encoded slashes, schemes,
// user-info and unicode whitespace) — common practice.
const BYPASSES = [
	'//evil.example/',
	'///evil.example/',
	'/\t/evil.example/',
	'/\n/evil.example/',
	'/\r/evil.example',
	'/\\evil.example',
	'\\\\evil.example',
	'/\\/evil.example',
	'/%2F/evil.example',
	'/%2f%2fevil.example',
	'/%5Cevil.example',
	'/%09/evil.example',
	'https://evil.example',
	'http:evil.example',
	'javascript:alert(1)',
	'data:text/html,<script>alert(1)</script>',
	'evil.example',
	'@evil.example',
	'/\u3000/evil.example',
	'/\u2028/evil.example',
	'/\ufeff/evil.example',
	'/.//evil.example',
	'/x/..//evil.example',
	'',
	'   /library'
];

describe('safeNext: only same-origin paths', () => {
	it.each(BYPASSES)('refuses %j', (next) => {
		expect(safeNext(next)).toBe('/account');
	});
	it('keeps ordinary paths with query and hash', () => {
		expect(safeNext('/library?q=thf&part=substrate')).toBe('/library?q=thf&part=substrate');
		expect(safeNext('/plans/12#review')).toBe('/plans/12#review');
		expect(safeNext('/window?substrate=3&pathCm=1')).toBe('/window?substrate=3&pathCm=1');
		expect(safeNext('/library/a%20b')).toBe('/library/a%20b');
		// A space is not a way out: it stays a path on this site.
		expect(safeNext('/ /evil.example')).toBe('/%20/evil.example');
	});
	it('falls back for null and missing', () => {
		expect(safeNext(null)).toBe('/account');
		expect(safeNext(undefined, '/')).toBe('/');
	});
});

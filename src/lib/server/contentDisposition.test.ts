import { describe, expect, it } from 'vitest';
import { attachment } from './contentDisposition';

// RFC 6266 §4.1 (disposition-parm), RFC 8187 §3.2 (ext-value: UTF-8'' + percent-encoding); Node's
// http module refuses header values with CR/LF or characters above U+00FF (ERR_INVALID_CHAR).
const headerOk = (v: string) => {
	const h = new Headers();
	h.set('content-disposition', v); // throws on invalid header characters
	return !/[\r\n]/.test(v) && /^[\x20-\x7e]*$/.test(v);
};

describe('Content-Disposition for any file name', () => {
	it.each([
		['plain.jdx', 'plain.jdx'],
		['spectrum – run 2.csv', 'spectrum – run 2.csv'],
		['αβγ-photoswitch.jdx', 'αβγ-photoswitch.jdx'],
		['光化学 data.csv', '光化学 data.csv'],
		['he said "hi".csv', 'he said "hi".csv'],
		['line\r\nbreak.csv', 'line break.csv'],
		['back\\slash/and/slash.csv', 'back-slash-and-slash.csv']
	])('%j', (name, decoded) => {
		const v = attachment(name);
		expect(headerOk(v)).toBe(true);
		expect(v.startsWith('attachment')).toBe(true);
		const star = /filename\*=UTF-8''([^;]+)/.exec(v);
		const plain = /filename="((?:[^"\\]|\\.)*)"/.exec(v);
		const got = star ? decodeURIComponent(star[1]) : plain![1].replace(/\\(.)/g, '$1');
		expect(got).toBe(decoded);
	});
});

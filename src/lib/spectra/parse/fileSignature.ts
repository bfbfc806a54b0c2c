/**
 * Recognises binary file types by their leading bytes ("magic numbers", as listed in each format's specification:
 * PNG ISO/IEC 15948, PDF ISO 32000, ZIP APPNOTE, gzip RFC 1952, …), so that a PNG or a PDF holding JCAMP-DX text
 * is refused as what it is rather than read as text.
 */

const SIGNATURES: [string, number[], number?][] = [
	['a PNG image', [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]],
	['a JPEG image', [0xff, 0xd8, 0xff]],
	['a GIF image', [0x47, 0x49, 0x46, 0x38]],
	['a TIFF image', [0x49, 0x49, 0x2a, 0x00]],
	['a TIFF image', [0x4d, 0x4d, 0x00, 0x2a]],
	['a WebP or RIFF file', [0x52, 0x49, 0x46, 0x46]],
	['a PDF document', [0x25, 0x50, 0x44, 0x46, 0x2d]],
	['a ZIP archive (or an Office document)', [0x50, 0x4b, 0x03, 0x04]],
	['a ZIP archive', [0x50, 0x4b, 0x05, 0x06]],
	['a gzip-compressed file', [0x1f, 0x8b]],
	['a bzip2-compressed file', [0x42, 0x5a, 0x68], 6],
	['an xz-compressed file', [0xfd, 0x37, 0x7a, 0x58, 0x5a, 0x00]],
	['a 7-Zip archive', [0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c]],
	['a RAR archive', [0x52, 0x61, 0x72, 0x21, 0x1a, 0x07]],
	['a Zstandard-compressed file', [0x28, 0xb5, 0x2f, 0xfd]],
	['an old-style Office document (OLE2)', [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]],
	['an HDF5 file', [0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a]],
	['a netCDF file', [0x43, 0x44, 0x46, 0x01]],
	['a netCDF file', [0x43, 0x44, 0x46, 0x02]],
	['an SQLite database', [0x53, 0x51, 0x4c, 0x69, 0x74, 0x65, 0x20, 0x66, 0x6f, 0x72, 0x6d, 0x61, 0x74, 0x20, 0x33, 0x00]],
	['an executable (ELF)', [0x7f, 0x45, 0x4c, 0x46]],
	['an executable (Windows)', [0x4d, 0x5a]],
	['a WebAssembly module', [0x00, 0x61, 0x73, 0x6d]]
];

/** Names the binary format the bytes start with, or undefined for anything else (text included). */
export function binarySignature(bytes: Uint8Array): string | undefined {
	for (const [name, sig, minLength] of SIGNATURES) {
		if (bytes.length < Math.max(sig.length, minLength ?? 0)) continue;
		let ok = true;
		for (let i = 0; i < sig.length && ok; i++) ok = bytes[i] === sig[i];
		if (!ok) continue;
		// "BZh" and "MZ" are also how text can begin: require the rest of the real header.
		if (sig[0] === 0x42 && !(bytes[3] >= 0x31 && bytes[3] <= 0x39 && bytes[4] === 0x31 && bytes[5] === 0x41)) continue;
		if (sig[0] === 0x4d && sig[1] === 0x5a && !(bytes.length > 0x40 && bytes.subarray(0, 0x40).includes(0))) continue;
		// RIFF: a 4-byte little-endian length follows, which text starting "RIFF" does not have.
		if (sig[0] === 0x52 && sig[1] === 0x49 && !bytes.subarray(4, 8).some((b) => b < 0x20 || b > 0x7e)) continue;
		return name;
	}
	return undefined;
}

/**
 * Float64 point arrays ↔ little-endian BLOB bytes (the `x_original`, `y_original`, `x_nm`,
 * `y_normalised` columns). Float32 search vectors use `vectorToBuffer`/`bufferToVector` of the core.
 */

/** Float64 values → little-endian bytes. */
export function float64ToBuffer(v: ArrayLike<number>): Buffer {
	const out = Buffer.alloc(v.length * 8);
	for (let i = 0; i < v.length; i++) out.writeDoubleLE(v[i], i * 8);
	return out;
}

/** Little-endian bytes → Float64 values (copies; any alignment). */
export function bufferToFloat64(buf: Uint8Array): Float64Array {
	if (buf.byteLength % 8 !== 0) throw new RangeError(`buffer of ${buf.byteLength} bytes is not a Float64 array`);
	const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
	const out = new Float64Array(buf.byteLength / 8);
	for (let i = 0; i < out.length; i++) out[i] = view.getFloat64(i * 8, true);
	return out;
}

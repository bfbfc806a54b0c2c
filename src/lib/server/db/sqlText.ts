/**
 * SQL text with its values already escaped, for the one statement that stores a whole upload
 * (db/spectra.ts storeNewFileOneTrip). Escaping is mysql2's own `escape` — the same client-side
 * escaping knex + mysql2 apply to every bound query — except BLOBs, which are written straight as
 * X'…' hex (what that escape produces, without a second scan of the hex text). Building the text
 * once here spares knex's query compiler and the placeholder passes of knex and mysql2 over a
 * statement that is mostly hex. Assumes the server's default SQL mode (backslash escapes on), as
 * mysql2 does.
 */
import mysql from 'mysql2';

/** A piece of SQL written as is (a user variable or an expression of constants; never user input). */
export class SqlExpr {
	constructor(readonly sql: string) {}
}

/** `@name + offset` (or `@name`) as a value. */
export const sqlVar = (name: string, offset = 0) => new SqlExpr(offset ? `@${name} + ${offset}` : `@${name}`);

/** One value as SQL text. */
export function sqlValue(v: unknown): string {
	if (v instanceof SqlExpr) return v.sql;
	if (v === undefined) return 'DEFAULT';
	if (v === null) return 'NULL';
	if (Buffer.isBuffer(v)) return `X'${v.toString('hex')}'`;
	if (v instanceof Uint8Array) return `X'${Buffer.from(v.buffer, v.byteOffset, v.byteLength).toString('hex')}'`;
	if (typeof v === 'number') {
		if (!Number.isFinite(v)) throw new RangeError(`sqlValue: ${v} is not a finite number`);
		return String(v);
	}
	if (typeof v === 'string' || typeof v === 'boolean') return mysql.escape(v);
	if (v instanceof Date) return mysql.escape(v, false, 'Z'); // the connection's time zone (knexfile.ts)
	throw new TypeError(`sqlValue: cannot write a ${typeof v} as SQL`);
}

const ident = (name: string) => {
	if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name)) throw new Error(`sqlText: unexpected identifier ${name}`);
	return '`' + name + '`';
};

/**
 * A multi-row INSERT as text. Columns are the union of the rows' keys; a row without a column gets
 * DEFAULT.
 */
export function insertSql(table: string, rows: Record<string, unknown>[], suffix = ''): string {
	if (!rows.length) throw new Error(`insertSql: no rows for ${table}`);
	const cols: string[] = [];
	const seen = new Set<string>();
	for (const r of rows)
		for (const k of Object.keys(r))
			if (!seen.has(k)) {
				seen.add(k);
				cols.push(k);
			}
	const values = rows.map((r) => '(' + cols.map((c) => sqlValue(r[c])).join(', ') + ')');
	return `INSERT${suffix ? ' ' + suffix : ''} INTO ${ident(table)} (${cols.map(ident).join(', ')}) VALUES ${values.join(', ')}`;
}

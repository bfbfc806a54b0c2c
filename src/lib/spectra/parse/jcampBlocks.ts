/**
 * Splits a JCAMP-DX text into its data blocks (LINK children or the single block) with their
 * 1-based line ranges and labelled data records. Label names are compared the JCAMP way:
 * case, spaces, '-', '_' and '/' are ignored (JCAMP-DX 4.24, McDonald & Wilks 1988, §4).
 */

export interface JcampBlock {
	/** 0-based line index of the block's ##TITLE and of its ##END (or last line). */
	start: number;
	end: number;
	/** Normalised label → value (comments after `$$` removed); first occurrence wins. */
	ldr: Map<string, string>;
	/** Normalised label → 0-based line index. */
	ldrLine: Map<string, number>;
	/** Records of the enclosing LINK block, when any. */
	parent?: Map<string, string>;
}

/** Normalises an LDR label: `## DATA TYPE` → `DATATYPE`, `$SOLVENT` stays `$SOLVENT`. */
export const normLabel = (label: string) => label.toUpperCase().replace(/[\s\-_/]/g, '');

const LDR = /^\s*##\s*([^=]*?)\s*=\s?(.*)$/;

function readLdrs(lines: string[], start: number, end: number, skipNested: boolean) {
	const ldr = new Map<string, string>();
	const ldrLine = new Map<string, number>();
	let depth = 0;
	for (let i = start; i <= end; i++) {
		const m = LDR.exec(lines[i]);
		if (!m) continue;
		const key = normLabel(m[1]);
		if (skipNested && i > start && key === 'TITLE') depth++;
		if (skipNested && depth > 0) {
			if (key === 'END') depth--;
			continue;
		}
		if (!ldr.has(key)) {
			ldr.set(key, m[2].replace(/\$\$.*$/, '').trim());
			ldrLine.set(key, i);
		}
	}
	return { ldr, ldrLine };
}

/** Returns the leaf blocks (blocks without nested ##TITLE) in file order. */
export function splitJcampBlocks(lines: string[]): JcampBlock[] {
	const stack: { start: number; hasChild: boolean }[] = [];
	const ranges: { start: number; end: number; leaf: boolean; parentStart?: number }[] = [];
	for (let i = 0; i < lines.length; i++) {
		const m = LDR.exec(lines[i]);
		if (!m) continue;
		const key = normLabel(m[1]);
		if (key === 'TITLE') {
			if (stack.length) stack[stack.length - 1].hasChild = true;
			stack.push({ start: i, hasChild: false });
		} else if (key === 'END' && stack.length) {
			const b = stack.pop()!;
			ranges.push({ start: b.start, end: i, leaf: !b.hasChild, parentStart: stack.at(-1)?.start });
		}
	}
	// A truncated file: close what is still open at the last line.
	while (stack.length) {
		const b = stack.pop()!;
		ranges.push({ start: b.start, end: lines.length - 1, leaf: !b.hasChild, parentStart: stack.at(-1)?.start });
	}
	const parents = new Map<number, Map<string, string>>();
	for (const r of ranges) if (!r.leaf) parents.set(r.start, readLdrs(lines, r.start, r.end, true).ldr);
	return ranges
		.filter((r) => r.leaf)
		.sort((a, b) => a.start - b.start)
		.map((r) => ({ start: r.start, end: r.end, ...readLdrs(lines, r.start, r.end, false), parent: r.parentStart === undefined ? undefined : parents.get(r.parentStart) }));
}

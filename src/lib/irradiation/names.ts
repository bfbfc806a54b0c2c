/**
 * A display name as it reads after "the" inside a sentence: a capitalised ordinary first word is lower-cased
 * ("Medium-pressure mercury lamp" → "medium-pressure mercury lamp"), acronyms and codes are kept ("UV-A tube",
 * "LED 365").
 */
export function nameInSentence(name: string): string {
	const first = name.split(/[\s-]/)[0] ?? '';
	if (first.length > 1 && first[0] === first[0].toUpperCase() && first.slice(1) === first.slice(1).toLowerCase() && /^\p{L}+$/u.test(first)) {
		return name[0].toLowerCase() + name.slice(1);
	}
	return name;
}

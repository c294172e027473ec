/**
 * Revision letters by ASME Y14.35: A, B, C … Y, then AA, AB …, never I, O, Q, S, X or Z (they
 * read as digits or are reserved); an initial release may be marked '-'.
 */
const usable = 'ABCDEFGHJKLMNPRTUVWY';

export const initialReleaseMark = '-';

export function isRevisionLetter(letter: string): boolean {
	if (letter === initialReleaseMark) return true;
	return /^[A-Z]{1,3}$/.test(letter) && [...letter].every((c) => usable.includes(c));
}

/** Position in the sequence (A = 0, Y = 19, AA = 20 …); '-' comes before A. */
export function revisionIndex(letter: string): number {
	if (letter === initialReleaseMark) return -1;
	let index = 0;
	for (const c of letter) index = index * usable.length + usable.indexOf(c) + 1;
	return index - 1;
}

export function revisionLetterAt(index: number): string {
	let n = index + 1;
	let letter = '';
	while (n > 0) {
		const digit = (n - 1) % usable.length;
		letter = usable[digit] + letter;
		n = Math.floor((n - 1) / usable.length);
	}
	return letter;
}

/** The letter after the latest of `existing` ('A' for the first revision). */
export function nextRevisionLetter(existing: string[]): string {
	const latest = Math.max(-1, ...existing.map(revisionIndex));
	return revisionLetterAt(latest + 1);
}

export function compareRevisionLetters(a: string, b: string) {
	return revisionIndex(a) - revisionIndex(b);
}

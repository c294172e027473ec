import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	isRevisionLetter,
	nextRevisionLetter,
	revisionIndex,
	revisionLetterAt
} from '../../src/lib/revision-letters';

// ASME Y14.35-2014 §3.2 (recalled): I, O, Q, S, X and Z are not used; after Y comes AA.
describe('revision letters', () => {
	it('run A … H, J … N, P, R, T … W, Y, then AA, AB', () => {
		const first = Array.from({ length: 23 }, (_, i) => revisionLetterAt(i));
		expect(first).toEqual([
			'A',
			'B',
			'C',
			'D',
			'E',
			'F',
			'G',
			'H',
			'J',
			'K',
			'L',
			'M',
			'N',
			'P',
			'R',
			'T',
			'U',
			'V',
			'W',
			'Y',
			'AA',
			'AB',
			'AC'
		]);
	});

	it('skip the same letters in two-letter revisions', () => {
		expect(nextRevisionLetter(['AH'])).toBe('AJ');
		expect(nextRevisionLetter(['AY'])).toBe('BA');
		expect(nextRevisionLetter(['YY'])).toBe('AAA');
	});

	it('start at A, also after an initial release marked -', () => {
		expect(nextRevisionLetter([])).toBe('A');
		expect(nextRevisionLetter(['-'])).toBe('A');
		expect(nextRevisionLetter(['A', 'C', 'B'])).toBe('D');
	});

	it('accept only letters of the sequence', () => {
		for (const ok of ['A', 'Y', 'AA', 'AB', '-']) expect(isRevisionLetter(ok)).toBe(true);
		for (const bad of ['I', 'O', 'Q', 'S', 'X', 'Z', 'AI', 'a', '1', '', 'A-']) {
			expect(isRevisionLetter(bad), bad).toBe(false);
		}
	});

	it('map positions and letters both ways', () => {
		fc.assert(
			fc.property(fc.integer({ min: 0, max: 8000 }), (index) => {
				const letter = revisionLetterAt(index);
				return isRevisionLetter(letter) && revisionIndex(letter) === index;
			})
		);
	});
});

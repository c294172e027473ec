/*
 * The callout parser's scanner: characters, numbers (decimals, inch fractions, deviations)
 * and words, one pass, no regular expressions, so a callout costs well under a microsecond and
 * bad text can never make it backtrack. A failure is thrown as a CalloutError; parseCallout
 * (./callout.ts) catches it and never throws.
 */
import { PER_INCH, neg, scanDecimal, toLength, type Units } from './decimal';
import type { WrittenValue } from './callout-types';

export class CalloutError {
	constructor(
		readonly message: string,
		readonly position: number
	) {}
}

export const MINUS = 45;
export const PLUS = 43;
export const SLASH = 47;
export const DOT = 46;
export const PLUS_MINUS = 0xb1;
export const TRUE_MINUS = 0x2212;
export const EN_DASH = 0x2013;
export const DEPTH_SYMBOL = 0x21a7;

export function isDigit(c: number): boolean {
	return c >= 48 && c <= 57;
}

export function isLetter(c: number): boolean {
	return (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
}

export function isSpace(c: number): boolean {
	return c === 32 || c === 9 || c === 0xa0 || (c >= 0x2000 && c <= 0x200a) || c === 0x202f;
}

export function isDiameterSign(c: number): boolean {
	// Ø, ø, ⌀ (U+2300), and ∅ which fonts often substitute for it.
	return c === 0xd8 || c === 0xf8 || c === 0x2300 || c === 0x2205;
}

export function isMinus(c: number): boolean {
	return c === MINUS || c === TRUE_MINUS;
}

export function describe(text: string, at: number): string {
	const c = text.codePointAt(at) ?? 0;
	if (isLetter(c)) {
		let end = at;
		while (end < text.length && isLetter(text.charCodeAt(end))) end++;
		return `'${text.slice(at, end)}'`;
	}
	return `'${String.fromCodePoint(c)}'`;
}

export class Scanner {
	pos = 0;
	end: number;
	comma = false;

	constructor(
		readonly text: string,
		readonly units: Units
	) {
		let end = text.length;
		while (end > 0 && isSpace(text.charCodeAt(end - 1))) end--;
		this.end = end;
		while (this.pos < end && isSpace(text.charCodeAt(this.pos))) this.pos++;
	}

	peek(offset = 0): number {
		const at = this.pos + offset;
		return at < this.end ? this.text.charCodeAt(at) : -1;
	}

	skipSpaces(): boolean {
		const start = this.pos;
		while (this.pos < this.end && isSpace(this.text.charCodeAt(this.pos))) this.pos++;
		return this.pos > start;
	}

	fail(message: string, at = this.pos): never {
		throw new CalloutError(message, at);
	}

	unexpected(expected: string): never {
		if (this.pos >= this.end) this.fail(`${expected}, but the callout ends here`, this.end - 1);
		this.fail(`${expected}, not ${describe(this.text, this.pos)}`);
	}

	/** Matches a whole word, case-insensitive, not followed by another letter. */
	word(upper: string): boolean {
		const n = upper.length;
		if (this.pos + n > this.end) return false;
		for (let i = 0; i < n; i++) {
			let c = this.text.charCodeAt(this.pos + i);
			if (c >= 97 && c <= 122) c -= 32;
			if (c !== upper.charCodeAt(i)) return false;
		}
		if (isLetter(this.peek(n))) return false;
		this.pos += n;
		return true;
	}

	integer(): number {
		const start = this.pos;
		let n = 0;
		while (this.pos < this.end && isDigit(this.text.charCodeAt(this.pos))) {
			n = n * 10 + this.text.charCodeAt(this.pos) - 48;
			this.pos++;
		}
		if (this.pos === start) this.unexpected('expected a whole number');
		if (this.pos - start > 9) this.fail('this number is too large', start);
		return n;
	}

	/** An unsigned number: a decimal, or in inch a fraction (1/4) or mixed number (1 1/2). */
	value(units: Units = this.units): WrittenValue {
		const start = this.pos;
		const c = this.peek();
		if (!isDigit(c) && !(c === DOT || c === 44)) this.unexpected('expected a number');
		const scanned = scanDecimal(this.text, start, this.end, units);
		if (scanned === null) {
			let i = start;
			while (i < this.end && (isDigit(this.text.charCodeAt(i)) || this.text.charCodeAt(i) === DOT))
				i++;
			if (i - start > 16) this.fail('this number has more digits than a size can have', start);
			if (isDigit(c) || isDigit(this.peek(1)))
				this.fail(
					`this number has more decimal places than Checkplate can hold exactly in ${units === 'mm' ? 'millimetres' : 'inches'}`,
					start
				);
			this.unexpected('expected a number');
		}
		this.pos = scanned.end;
		if (scanned.places > 0) {
			if (this.text.charCodeAt(scanned.end - scanned.places - 1) === 44) this.comma = true;
			return { value: scanned.value, places: scanned.places };
		}
		if (units === 'in') {
			const whole = scanned.value / PER_INCH;
			if (this.peek() === SLASH && this.isPlainFraction(this.pos + 1)) {
				return this.fraction(0, whole, start);
			}
			// Mixed number: '1 1/2'.
			const save = this.pos;
			if (this.skipSpaces() && isDigit(this.peek())) {
				let i = this.pos;
				while (i < this.end && isDigit(this.text.charCodeAt(i))) i++;
				if (i < this.end && this.text.charCodeAt(i) === SLASH && this.isPlainFraction(i + 1)) {
					const numerator = this.integer();
					return this.fraction(whole, numerator, start);
				}
			}
			this.pos = save;
		}
		return { value: scanned.value, places: 0 };
	}

	/** After '/': digits not followed by a decimal point, so '1/4' rather than '1.000/0.998'. */
	private isPlainFraction(at: number): boolean {
		let i = at;
		while (i < this.end && isDigit(this.text.charCodeAt(i))) i++;
		if (i === at) return false;
		const c = i < this.end ? this.text.charCodeAt(i) : -1;
		const n = i + 1 < this.end ? this.text.charCodeAt(i + 1) : -1;
		return !((c === DOT || c === 44) && isDigit(n));
	}

	/** At the '/' of an inch fraction; `whole` and `numerator` already read. */
	private fraction(whole: number, numerator: number, start: number): WrittenValue {
		this.pos++;
		const denominator = this.integer();
		if (denominator === 0) this.fail('a fraction cannot have a denominator of 0', start);
		const numeratorValue = numerator * PER_INCH;
		if (numeratorValue % denominator !== 0)
			this.fail(
				`${numerator}/${denominator} in is not an exact length; write it as a decimal`,
				start
			);
		return {
			value: toLength(whole * PER_INCH + numeratorValue / denominator),
			places: 0,
			fraction: { whole, numerator, denominator }
		};
	}

	/** A signed deviation; a zero may go unsigned (ASME Y14.5: a single zero, no sign). */
	deviation(): WrittenValue {
		const start = this.pos;
		const c = this.peek();
		let negative = false;
		if (c === PLUS) this.pos++;
		else if (isMinus(c)) {
			negative = true;
			this.pos++;
		}
		const v = this.value();
		if (c !== PLUS && !negative && v.value !== 0)
			this.fail('a deviation needs its sign, e.g. +0.021 or -0.020', start);
		if (negative && v.value !== 0) v.value = neg(v.value);
		return v;
	}
}

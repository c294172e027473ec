/*
 * The callout grammar: sizes, tolerances, ISO classes, modifiers, quantities and depths, read
 * with the scanner of ./callout-scanner.ts (threads in ./callout-thread.ts).
 */
import { ZERO, add, sub, type Length, type Units } from './decimal';
import type {
	CalloutSpec,
	CalloutSymbol,
	Modifier,
	ParseOptions,
	ParseResult,
	Tolerance,
	ToleranceClass,
	WrittenValue
} from './callout-types';

import {
	CalloutError,
	DEPTH_SYMBOL,
	DOT,
	EN_DASH,
	MINUS,
	PLUS,
	PLUS_MINUS,
	SLASH,
	Scanner,
	TRUE_MINUS,
	isDiameterSign,
	isDigit,
	isLetter,
	isMinus,
	isSpace
} from './callout-scanner';
import {
	metricThread,
	numberSizeDiameter,
	unifiedThread,
	unifiedThreadAhead
} from './callout-thread';

const HOLE_DEVIATIONS = new Set([
	'A',
	'B',
	'C',
	'CD',
	'D',
	'E',
	'EF',
	'F',
	'FG',
	'G',
	'H',
	'J',
	'JS',
	'K',
	'M',
	'N',
	'P',
	'R',
	'S',
	'T',
	'U',
	'V',
	'X',
	'Y',
	'Z',
	'ZA',
	'ZB',
	'ZC'
]);

const TEXT_MODIFIERS: Record<string, Modifier> = {
	E: 'envelope',
	I: 'independency',
	F: 'freeState',
	ST: 'statistical',
	CF: 'continuousFeature',
	LP: 'twoPointSize',
	LS: 'sphereSize',
	GG: 'leastSquaresSize',
	GX: 'maximumInscribedSize',
	GN: 'minimumCircumscribedSize',
	CC: 'circumferenceDiameter',
	CA: 'areaDiameter',
	CV: 'volumeDiameter'
};

function toleranceClass(s: Scanner, at: number): ToleranceClass | null {
	// Letters then the IT grade: H7, js6, ZC11, h01.
	const text = s.text;
	let i = at;
	while (i < s.end && i - at < 3 && isLetter(text.charCodeAt(i))) i++;
	if (i === at || i - at > 2 || i >= s.end || !isDigit(text.charCodeAt(i))) return null;
	const letters = text.slice(at, i);
	const upper = letters.toUpperCase();
	if (upper === 'DP') return null;
	if (!HOLE_DEVIATIONS.has(upper)) {
		s.fail(`${letters} is not an ISO 286 fundamental deviation`, at);
	}
	const lower = letters.toLowerCase();
	if (letters !== upper && letters !== lower)
		s.fail(`write ${upper} for a hole or ${lower} for a shaft; the case says which it is`, at);
	let j = i;
	while (j < s.end && isDigit(text.charCodeAt(j))) j++;
	const grade = text.slice(i, j);
	const gradeNumber = Number(grade);
	if (
		grade !== '01' &&
		(grade.length > 2 || (grade.startsWith('0') && grade !== '0') || gradeNumber > 18)
	)
		s.fail(`IT${grade} is not an ISO 286 tolerance grade (IT01, IT0, IT1 … IT18)`, i);
	if (isLetter(j < s.end ? text.charCodeAt(j) : -1)) return null;
	s.pos = j;
	return {
		// The code as written, in one piece (letters and grade are adjacent in the text).
		code: text.slice(at, j),
		deviation: letters,
		grade,
		feature: letters === upper ? 'hole' : 'shaft'
	};
}

function readSymbol(s: Scanner): CalloutSymbol | null {
	const c = s.peek();
	if (isDiameterSign(c)) {
		s.pos++;
		return 'diameter';
	}
	if (c === 83 /* S */) {
		const n = s.peek(1);
		if (isDiameterSign(n)) {
			s.pos += 2;
			return 'sphericalDiameter';
		}
		if (n === 82 /* R */ && !isLetter(s.peek(2))) {
			s.pos += 2;
			return 'sphericalRadius';
		}
	}
	if (c === 82 /* R */ && !isLetter(s.peek(1))) {
		s.pos++;
		return 'radius';
	}
	if (c === 67 /* C */ && s.peek(1) === 82 && !isLetter(s.peek(2))) {
		s.pos += 2;
		return 'controlledRadius';
	}
	if (s.word('DIA')) {
		if (s.peek() === DOT) s.pos++;
		return 'diameter';
	}
	return null;
}

function limitPair(s: Scanner, first: WrittenValue): Tolerance {
	s.skipSpaces();
	const secondAt = s.pos;
	const second = s.value();
	if (second.value === first.value)
		s.fail('the two limits are equal; a size needs a tolerance between them', secondAt);
	const upperFirst = first.value > second.value;
	return upperFirst
		? { type: 'limits', upper: first, lower: second, upperFirst }
		: { type: 'limits', lower: first, upper: second, upperFirst };
}

function deviationPair(s: Scanner, first?: WrittenValue): Tolerance {
	const a = first ?? s.deviation();
	const hadSpace = s.skipSpaces();
	if (s.peek() === SLASH) {
		s.pos++;
		s.skipSpaces();
	} else if (!hadSpace || s.pos >= s.end) {
		s.unexpected('expected a second deviation after a slash, e.g. +0.021/0 or 0/-0.020');
	}
	const secondAt = s.pos;
	const b = s.deviation();
	if (a.value === b.value)
		s.fail('the two deviations are equal; a size needs a tolerance between them', secondAt);
	return a.value > b.value
		? { type: 'deviations', upper: a, lower: b }
		: { type: 'deviations', upper: b, lower: a };
}

function bilateral(s: Scanner): Tolerance {
	const at = s.pos;
	s.skipSpaces();
	if (s.pos >= s.end) s.fail('expected a tolerance after ±', at - 1);
	if (isMinus(s.peek()) || s.peek() === PLUS)
		s.fail('± already gives both signs; write the tolerance without one');
	const c = s.peek();
	if (!isDigit(c) && c !== DOT && c !== 44) s.unexpected('expected a tolerance after ±');
	const deviationAt = s.pos;
	const deviation = s.value();
	if (deviation.value === 0) s.fail('a ± tolerance of zero leaves no tolerance', deviationAt);
	return { type: 'bilateral', deviation };
}

/** At ±, +/-, +-: consumes it and returns true. */
function plusMinus(s: Scanner): boolean {
	const c = s.peek();
	if (c === PLUS_MINUS) {
		s.pos++;
		return true;
	}
	if (c === PLUS) {
		if (s.peek(1) === SLASH && isMinus(s.peek(2))) {
			s.pos += 3;
			return true;
		}
		if (isMinus(s.peek(1))) {
			s.pos += 2;
			return true;
		}
	}
	return false;
}

/** The tolerance inside parentheses after an ISO class: limits, deviations or ±. */
function statedTolerance(s: Scanner): Tolerance {
	s.skipSpaces();
	const c = s.peek();
	if (plusMinus(s)) return bilateral(s);
	if (c === PLUS || isMinus(c)) return deviationPair(s);
	const at = s.pos;
	const first = s.value();
	s.skipSpaces();
	const sep = s.peek();
	if (sep === SLASH) {
		const slashAt = s.pos;
		s.pos++;
		s.skipSpaces();
		const n = s.peek();
		if (n === PLUS || isMinus(n) || first.value === 0) {
			s.pos = at;
			return deviationPair(s);
		}
		s.pos = slashAt + 1;
		return limitPair(s, first);
	}
	if (sep === MINUS || sep === EN_DASH || sep === TRUE_MINUS) {
		s.pos++;
		return limitPair(s, first);
	}
	return s.unexpected('expected a second limit, e.g. 25.000/25.021');
}

function closeParen(s: Scanner, openAt: number): void {
	s.skipSpaces();
	if (s.peek() !== 41) {
		if (s.pos >= s.end) s.fail('this parenthesis is never closed', openAt);
		s.unexpected("expected ')'");
	}
	s.pos++;
}

function singleLimit(s: Scanner): 'min' | 'max' | null {
	const limit = s.word('MIN') ? 'min' : s.word('MAX') ? 'max' : null;
	if (limit !== null && s.peek() === DOT) s.pos++;
	return limit;
}

function tail(s: Scanner, spec: CalloutSpec): void {
	for (;;) {
		s.skipSpaces();
		if (s.pos >= s.end) return;
		const at = s.pos;
		const c = s.peek();
		if (c === 0x24ba || c === 0x24be || c === 0x24bb) {
			s.pos++;
			addModifier(
				s,
				spec,
				c === 0x24ba ? 'envelope' : c === 0x24be ? 'independency' : 'freeState',
				at
			);
			continue;
		}
		if (c === 40 || c === 60 || c === 0x27e8 || c === 0x2329 || c === 0x3008) {
			const close =
				c === 40 ? 41 : c === 60 ? 62 : c === 0x27e8 ? 0x27e9 : c === 0x2329 ? 0x232a : 0x3009;
			let i = s.pos + 1;
			while (i < s.end && isLetter(s.text.charCodeAt(i))) i++;
			const code = s.text.slice(s.pos + 1, i).toUpperCase();
			const modifier = TEXT_MODIFIERS[code];
			if (modifier !== undefined && i < s.end && s.text.charCodeAt(i) === close) {
				if (c !== 40 && modifier !== 'statistical' && modifier !== 'continuousFeature')
					s.fail(`write (${code}) in parentheses`, at);
				s.pos = i + 1;
				addModifier(s, spec, modifier, at);
				continue;
			}
			if (c === 40 && spec.kind === 'size' && isLetter(s.peek(1))) {
				const cls = toleranceClass(s, at + 1);
				if (cls !== null) s.fail('a tolerance class goes right after the size: Ø25 H7', at + 1);
			}
			s.unexpected('expected a modifier such as Ⓔ, (E) or ⟨ST⟩');
		}
		if (s.word('THRU')) {
			if (spec.depth !== null) s.fail('a hole is either THRU or has a depth, not both', at);
			if (spec.kind === 'basic' || spec.kind === 'reference')
				s.fail('THRU belongs to a hole or thread callout', at);
			spec.thru = true;
			continue;
		}
		if (c === DEPTH_SYMBOL || s.word('DEPTH') || s.word('DP')) {
			if (c === DEPTH_SYMBOL) s.pos++;
			depth(s, spec, at);
			continue;
		}
		if (isDigit(c) || c === DOT) {
			depth(s, spec, at);
			if (!s.skipSpaces() && s.pos < s.end) s.unexpected("expected 'DEEP'");
			if (!s.word('DEEP')) s.unexpected("expected 'DEEP' after a depth");
			continue;
		}
		if (spec.kind === 'size' && spec.symbol === null && spec.nominal !== null && s.word('DIA')) {
			if (s.peek() === DOT) s.pos++;
			spec.symbol = 'diameter';
			continue;
		}
		if (spec.kind === 'size' && s.word('REF')) {
			if (spec.tolerance !== null || spec.toleranceClass !== null || spec.fit !== null)
				s.fail('a reference dimension carries no tolerance', at);
			if (spec.nominal === null) s.fail('expected a size before REF', at);
			spec.kind = 'reference';
			continue;
		}
		if (spec.kind === 'size' && spec.tolerance === null && spec.nominal !== null) {
			const limit = singleLimit(s);
			if (limit !== null) {
				if (spec.toleranceClass !== null || spec.fit !== null)
					s.fail(`a size with a tolerance class cannot also be ${limit.toUpperCase()}`, at);
				spec.tolerance = { type: 'single', limit };
				continue;
			}
		}
		s.unexpected('expected the end of the callout');
	}
}

function addModifier(s: Scanner, spec: CalloutSpec, modifier: Modifier, at: number): void {
	if (spec.kind !== 'size') s.fail('modifiers apply to a toleranced size', at);
	if (spec.modifiers.includes(modifier)) s.fail('this modifier is already given', at);
	spec.modifiers.push(modifier);
}

function depth(s: Scanner, spec: CalloutSpec, at: number): void {
	if (spec.thru) s.fail('a hole is either THRU or has a depth, not both', at);
	if (spec.depth !== null) s.fail('the depth is already given', at);
	if (spec.kind === 'basic' || spec.kind === 'reference')
		s.fail('a depth belongs to a hole or thread callout', at);
	s.skipSpaces();
	const valueAt = s.pos;
	spec.depth = s.value();
	if (spec.depth.value === 0) s.fail('a depth of zero', valueAt);
}

function quantity(s: Scanner): number | null {
	if (!isDigit(s.peek())) return null;
	const text = s.text;
	const start = s.pos;
	let i = start;
	while (i < s.end && isDigit(text.charCodeAt(i))) i++;
	const afterDigits = i;
	while (i < s.end && isSpace(text.charCodeAt(i))) i++;
	const c = i < s.end ? text.charCodeAt(i) : -1;
	let next = -1;
	if (c === 88 || c === 120 || c === 0xd7) {
		// 4X Ø6, 2×R5, 4XM6: a letter or digit right after the X is no quantity, except the
		// upper-case letters that start a size symbol or a metric thread.
		const after = i + 1 < s.end ? text.charCodeAt(i + 1) : -1;
		const word = isLetter(after) || isDigit(after) || after === DOT || after === 44;
		if (!word || after === 82 || after === 83 || after === 77 || after === 67) next = i + 1;
	} else if (i > afterDigits) {
		s.pos = i;
		if (s.word('PLACES') || s.word('PL')) {
			if (s.peek() === DOT) s.pos++;
			next = s.pos;
		}
		s.pos = start;
	}
	if (next < 0) return null;
	if (afterDigits - start > 6) s.fail('this quantity is too large', start);
	const count = Number(text.slice(start, afterDigits));
	if (count === 0) s.fail('a quantity must be at least 1', start);
	s.pos = next;
	s.skipSpaces();
	if (s.pos >= s.end) s.fail('expected a size after the quantity', next - 1);
	return count;
}

function emptySpec(units: Units): CalloutSpec {
	return {
		kind: 'size',
		units,
		quantity: null,
		symbol: null,
		nominal: null,
		tolerance: null,
		toleranceClass: null,
		fit: null,
		classPlacement: null,
		modifiers: [],
		thread: null,
		thru: false,
		depth: null,
		decimalSeparator: '.'
	};
}

function bracketed(
	s: Scanner,
	spec: CalloutSpec,
	close: number,
	kind: 'basic' | 'reference'
): void {
	const openAt = s.pos;
	s.pos++;
	s.skipSpaces();
	spec.kind = kind;
	spec.symbol = readSymbol(s);
	s.skipSpaces();
	spec.nominal = s.value();
	s.skipSpaces();
	if (s.peek() !== close) {
		if (s.pos >= s.end)
			s.fail(
				kind === 'basic'
					? 'this basic dimension frame is never closed'
					: 'this parenthesis is never closed',
				openAt
			);
		s.unexpected(
			kind === 'basic'
				? "a basic dimension carries no tolerance; expected ']'"
				: "a reference dimension carries no tolerance; expected ')'"
		);
	}
	s.pos++;
}

function size(s: Scanner, spec: CalloutSpec, prefixLimit: 'min' | 'max' | null): void {
	spec.symbol = readSymbol(s);
	s.skipSpaces();
	const firstAt = s.pos;
	if (spec.symbol === null && s.peek() === 35 /* # */) {
		s.pos++;
		const n = s.integer();
		if (n > 12) s.fail(`#${n} is not a unified number size (#0 to #12)`, firstAt);
		if (!unifiedThreadAhead(s)) s.unexpected('expected threads per inch after a number size');
		spec.kind = 'thread';
		spec.thread = unifiedThread(s, numberSizeDiameter(n), n);
		return;
	}
	const c = s.peek();
	if (!isDigit(c) && c !== DOT && !(c === 44 && isDigit(s.peek(1)))) {
		if (plusMinus(s) || c === PLUS || isMinus(c))
			s.fail('expected the size before its tolerance', firstAt);
		s.unexpected(
			spec.symbol === null
				? 'expected a size, e.g. Ø25 H7 or 25.000-25.021'
				: 'expected a size after the symbol'
		);
	}
	const first = s.value();
	if (spec.symbol === null && s.units === 'in' && unifiedThreadAhead(s)) {
		spec.kind = 'thread';
		spec.thread = unifiedThread(s, first, null);
		return;
	}
	const hadSpace = s.skipSpaces();
	const d = s.peek();
	if (prefixLimit !== null) {
		spec.nominal = first;
		spec.tolerance = { type: 'single', limit: prefixLimit };
		return;
	}
	if (plusMinus(s)) {
		spec.nominal = first;
		spec.tolerance = bilateral(s);
	} else if (d === PLUS) {
		spec.nominal = first;
		spec.tolerance = deviationPair(s);
	} else if ((d === MINUS || d === TRUE_MINUS) && hadSpace && !isSpace(s.peek(1))) {
		spec.nominal = first;
		spec.tolerance = deviationPair(s);
	} else if (d === MINUS || d === EN_DASH || d === TRUE_MINUS || d === SLASH) {
		s.pos++;
		spec.tolerance = limitPair(s, first);
	} else if (hadSpace && (isDigit(d) || d === DOT) && zeroDeviationAhead(s)) {
		spec.nominal = first;
		spec.tolerance = deviationPair(s);
	} else {
		spec.nominal = first;
		const cls = isLetter(d) ? toleranceClass(s, s.pos) : null;
		if (cls !== null) {
			isoClass(s, spec, cls);
			return;
		}
	}
	if (spec.tolerance !== null) {
		// Class after the numbers: 25.000/25.021 (H7).
		const save = s.pos;
		s.skipSpaces();
		if (s.peek() === 40 && isLetter(s.peek(1))) {
			const openAt = s.pos;
			const cls = toleranceClass(s, s.pos + 1);
			if (cls !== null) {
				setClass(s, spec, cls, openAt + 1);
				if (s.peek() === SLASH) s.fail('write a fit designation after the size: Ø25 H7/g6');
				closeParen(s, openAt);
				spec.classPlacement = 'after';
				return;
			}
		}
		s.pos = save;
	}
}

/** '0/…' or '.000/…' after a size: the unsigned zero of a unilateral tolerance. */
function zeroDeviationAhead(s: Scanner): boolean {
	const save = s.pos;
	const v = s.value();
	s.skipSpaces();
	const slash = s.peek() === SLASH;
	s.pos = save;
	return slash && v.value === 0;
}

function setClass(s: Scanner, spec: CalloutSpec, cls: ToleranceClass, at: number): void {
	spec.toleranceClass = cls;
	if (
		spec.symbol === 'radius' ||
		spec.symbol === 'sphericalRadius' ||
		spec.symbol === 'controlledRadius'
	)
		s.fail('an ISO 286 tolerance class applies to a size such as a diameter, not a radius', at);
}

function isoClass(s: Scanner, spec: CalloutSpec, cls: ToleranceClass): void {
	const at = s.pos - cls.code.length;
	setClass(s, spec, cls, at);
	if (s.peek() === SLASH) {
		s.pos++;
		const shaftAt = s.pos;
		const shaft = isLetter(s.peek()) ? toleranceClass(s, s.pos) : null;
		if (shaft === null) s.unexpected('expected the shaft class of the fit, e.g. H7/g6');
		if (cls.feature !== 'hole')
			s.fail(`in a fit the hole class comes first, in upper case: ${cls.code.toUpperCase()}/…`, at);
		if (shaft.feature !== 'shaft')
			s.fail(
				`${shaft.code} is a hole tolerance class; the second class of a fit is the shaft's, in lower case`,
				shaftAt
			);
		spec.toleranceClass = null;
		spec.fit = { hole: cls, shaft };
		return;
	}
	const save = s.pos;
	s.skipSpaces();
	if (s.peek() === 40) {
		const n = s.peek(1);
		if (isDigit(n) || n === DOT || n === PLUS || isMinus(n) || n === PLUS_MINUS || isSpace(n)) {
			const openAt = s.pos;
			s.pos++;
			spec.tolerance = statedTolerance(s);
			closeParen(s, openAt);
			spec.classPlacement = 'before';
			return;
		}
	}
	s.pos = save;
}

function checkFeature(
	spec: CalloutSpec,
	feature: 'hole' | 'shaft' | undefined,
	text: string
): void {
	const cls = spec.toleranceClass;
	if (feature === undefined || cls === null || cls.feature === feature) return;
	const at = Math.max(0, text.indexOf(cls.code));
	throw new CalloutError(
		feature === 'shaft'
			? `${cls.code} is a hole tolerance class; a shaft needs a lower-case letter`
			: `${cls.code} is a shaft tolerance class; a hole needs an upper-case letter`,
		at
	);
}

/** Reads a size callout. Never throws: bad text gives a message and the character at fault. */
export function parseCallout(text: string, options: ParseOptions): ParseResult {
	try {
		if (typeof text !== 'string') return { ok: false, message: 'expected text', position: 0 };
		const units: Units = options?.units === 'in' ? 'in' : 'mm';
		const s = new Scanner(text, units);
		if (s.pos >= s.end) return { ok: false, message: 'the callout is empty', position: 0 };
		const spec = emptySpec(units);
		spec.quantity = quantity(s);
		const c = s.peek();
		if (c === 91 /* [ */) bracketed(s, spec, 93, 'basic');
		else if (c === 40 /* ( */) bracketed(s, spec, 41, 'reference');
		else if (c === 77 /* M */ && isDigit(s.peek(1))) {
			spec.kind = 'thread';
			spec.thread = metricThread(s);
		} else {
			const prefixLimit = singleLimit(s);
			if (prefixLimit !== null) s.skipSpaces();
			size(s, spec, prefixLimit);
		}
		tail(s, spec);
		if (s.comma) spec.decimalSeparator = ',';
		checkFeature(spec, options?.feature, text);
		return { ok: true, spec };
	} catch (e) {
		if (e instanceof CalloutError) {
			const last = Math.max(0, text.length - 1);
			return { ok: false, message: e.message, position: Math.min(Math.max(0, e.position), last) };
		}
		return { ok: false, message: 'Checkplate could not read this callout', position: 0 };
	}
}

/**
 * The limits of size a callout states in numbers, or null where they must come from
 * elsewhere (an ISO class alone: iso286.ts; no tolerance: the general tolerance).
 * A single limit leaves the other side open (null).
 */
export function calloutLimits(
	spec: CalloutSpec
): { lower: Length | null; upper: Length | null } | null {
	const t = spec.tolerance;
	if (t === null || spec.kind !== 'size') return null;
	const nominal = spec.nominal?.value ?? ZERO;
	switch (t.type) {
		case 'limits':
			return { lower: t.lower.value, upper: t.upper.value };
		case 'bilateral':
			return { lower: sub(nominal, t.deviation.value), upper: add(nominal, t.deviation.value) };
		case 'deviations':
			return { lower: add(nominal, t.lower.value), upper: add(nominal, t.upper.value) };
		case 'single':
			return t.limit === 'min' ? { lower: nominal, upper: null } : { lower: null, upper: nominal };
	}
}

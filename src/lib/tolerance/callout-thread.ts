/*
 * The thread grammar of the callout parser: ISO 261/965 metric threads (M6, M10x1.25-6g LH)
 * and ASME B1.1 unified threads (1/4-20 UNC-2A, #10-32 UNF).
 */
import { PER_INCH, toLength } from './decimal';
import type { ThreadSpec, WrittenValue } from './callout-types';
import { MINUS, Scanner, isDigit, isLetter, isSpace } from './callout-scanner';

/** True when a unified thread follows: '-' digits, optional space, 'UN'. */
export function unifiedThreadAhead(s: Scanner): boolean {
	if (s.peek() !== MINUS) return false;
	let i = s.pos + 1;
	const text = s.text;
	const start = i;
	while (i < s.end && isDigit(text.charCodeAt(i))) i++;
	if (i === start) return false;
	while (i < s.end && isSpace(text.charCodeAt(i))) i++;
	return (
		i + 1 < s.end &&
		(text.charCodeAt(i) | 32) === 117 /* u */ &&
		(text.charCodeAt(i + 1) | 32) === 110 /* n */
	);
}

function leftHand(s: Scanner): boolean {
	const save = s.pos;
	if (s.peek() === MINUS) s.pos++;
	else s.skipSpaces();
	if (s.word('LH')) return true;
	s.pos = save;
	return false;
}

export function metricThread(s: Scanner): ThreadSpec {
	s.pos++; // 'M'
	const diameter = s.value('mm');
	let pitch: WrittenValue | null = null;
	const x = s.peek();
	if (x === 120 || x === 88 || x === 0xd7) {
		s.pos++;
		pitch = s.value('mm');
		if (pitch.value === 0) s.fail('a thread pitch cannot be zero', s.pos - 1);
	}
	let toleranceClass: string | null = null;
	if (s.peek() === MINUS && isDigit(s.peek(1))) {
		s.pos++;
		toleranceClass = threadClass(s, 'metric');
	}
	return { system: 'metric', diameter, pitch, toleranceClass, leftHand: leftHand(s) };
}

function threadClass(s: Scanner, system: 'metric' | 'unified'): string {
	// ISO 965-1: pitch-diameter then crest class, each grade digit + position letter (5g6g, 6H).
	// ASME B1.1: class digit 1–3 + A (external) or B (internal).
	const start = s.pos;
	const text = s.text;
	let i = start;
	for (let part = 0; part < 2; part++) {
		const d = i;
		if (!isDigit(text.charCodeAt(i))) break;
		i++;
		const letter = i < s.end ? text.charCodeAt(i) : -1;
		const ok =
			system === 'metric'
				? letter === 71 || letter === 72 || (letter >= 101 && letter <= 104)
				: letter === 65 || letter === 66;
		if (!ok) {
			i = d;
			break;
		}
		i++;
		if (system === 'unified') break;
	}
	if (
		i === start ||
		isLetter(i < s.end ? text.charCodeAt(i) : -1) ||
		isDigit(i < s.end ? text.charCodeAt(i) : -1)
	) {
		s.pos = start;
		s.fail(
			system === 'metric'
				? 'expected an ISO 965 thread tolerance class such as 6H or 6g'
				: 'expected a unified thread class such as 2A or 2B'
		);
	}
	s.pos = i;
	const cls = text.slice(start, i);
	if (system === 'metric' && cls.length === 4) {
		const a = cls.charCodeAt(1) < 97;
		const b = cls.charCodeAt(3) < 97;
		if (a !== b) s.fail('both parts of a thread class name the same side: 5H6H or 5g6g', start);
	}
	return cls;
}

export function unifiedThread(
	s: Scanner,
	diameter: WrittenValue,
	numberSize: number | null
): ThreadSpec {
	s.pos++; // '-'
	const tpiAt = s.pos;
	const threadsPerInch = s.integer();
	if (threadsPerInch === 0) s.fail('threads per inch cannot be zero', tpiAt);
	s.skipSpaces();
	const seriesAt = s.pos;
	while (s.pos < s.end && isLetter(s.peek())) s.pos++;
	const series = s.text.slice(seriesAt, s.pos).toUpperCase();
	let toleranceClass: string | null = null;
	if (s.peek() === MINUS && isDigit(s.peek(1))) {
		s.pos++;
		toleranceClass = threadClass(s, 'unified');
	}
	return {
		system: 'unified',
		diameter,
		numberSize,
		threadsPerInch,
		series,
		toleranceClass,
		leftHand: leftHand(s)
	};
}

/** ASME B1.1 number sizes: major diameter 0.060 + 0.013 n inch. */
export function numberSizeDiameter(n: number): WrittenValue {
	return { value: toLength((60 + 13 * n) * (PER_INCH / 1000)), places: 3 };
}

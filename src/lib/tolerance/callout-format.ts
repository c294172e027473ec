import { abs, formatLength, type Units } from './decimal';
import type {
	CalloutSpec,
	CalloutSymbol,
	Modifier,
	ThreadSpec,
	WrittenValue
} from './callout-types';

const SYMBOLS: Record<CalloutSymbol, string> = {
	diameter: 'Ø',
	radius: 'R',
	controlledRadius: 'CR',
	sphericalDiameter: 'SØ',
	sphericalRadius: 'SR'
};

const MODIFIERS: Record<Modifier, string> = {
	envelope: 'Ⓔ',
	independency: 'Ⓘ',
	freeState: 'Ⓕ',
	statistical: '⟨ST⟩',
	continuousFeature: '⟨CF⟩',
	twoPointSize: '(LP)',
	sphereSize: '(LS)',
	leastSquaresSize: '(GG)',
	maximumInscribedSize: '(GX)',
	minimumCircumscribedSize: '(GN)',
	circumferenceDiameter: '(CC)',
	areaDiameter: '(CA)',
	volumeDiameter: '(CV)'
};

/**
 * A written value in the drawing's convention: inch without the leading zero (ASME Y14.5
 * §1.6.2), metric with it (ISO 129-1), fractions as fractions. Magnitude only; signs are
 * added by the caller.
 */
export function formatWrittenValue(v: WrittenValue, units: Units, separator: '.' | ','): string {
	if (v.fraction) {
		const { whole, numerator, denominator } = v.fraction;
		return (whole > 0 ? `${whole} ` : '') + `${numerator}/${denominator}`;
	}
	return formatLength(abs(v.value), units, v.places, {
		leadingZero: units === 'mm',
		decimalSeparator: separator
	});
}

function formatDeviation(v: WrittenValue, upper: boolean, units: Units, sep: '.' | ','): string {
	const digits = formatWrittenValue(v, units, sep);
	if (v.value > 0) return '+' + digits;
	if (v.value < 0) return '-' + digits;
	// ASME Y14.5 §1.6.1: a metric nil deviation is a single 0 without sign; in inch (§1.6.2)
	// the zero keeps the other value's places and takes its sign.
	if (v.places === 0 && !v.fraction) return '0';
	return (upper ? '+' : '-') + digits;
}

function formatThread(t: ThreadSpec, sep: '.' | ','): string {
	if (t.system === 'metric') {
		let text = 'M' + formatWrittenValue(t.diameter, 'mm', sep);
		if (t.pitch) text += 'x' + formatWrittenValue(t.pitch, 'mm', sep);
		if (t.toleranceClass) text += '-' + t.toleranceClass;
		return t.leftHand ? text + '-LH' : text;
	}
	let text = t.numberSize !== null ? `#${t.numberSize}` : formatWrittenValue(t.diameter, 'in', sep);
	text += `-${t.threadsPerInch} ${t.series}`;
	if (t.toleranceClass) text += '-' + t.toleranceClass;
	return t.leftHand ? text + '-LH' : text;
}

/** The canonical text of a callout; parseCallout reads it back to the same spec. */
export function formatCallout(spec: CalloutSpec): string {
	const { units, decimalSeparator: sep } = spec;
	const value = (v: WrittenValue) => formatWrittenValue(v, units, sep);
	// A whole inch before a slash would read as a fraction (2/1), so the slash gets spaces.
	const slash = (v: WrittenValue) =>
		units === 'in' && v.places === 0 && !v.fraction ? ' / ' : '/';
	let text = spec.quantity !== null ? `${spec.quantity}X ` : '';
	const symbol = spec.symbol ? SYMBOLS[spec.symbol] : '';
	if (spec.kind === 'basic' && spec.nominal) {
		text += `[${symbol}${value(spec.nominal)}]`;
	} else if (spec.kind === 'reference' && spec.nominal) {
		text += `(${symbol}${value(spec.nominal)})`;
	} else if (spec.kind === 'thread' && spec.thread) {
		text += formatThread(spec.thread, sep);
	} else {
		text += symbol;
		const parts: string[] = [];
		if (spec.nominal) parts.push(value(spec.nominal));
		const t = spec.tolerance;
		let numbers = '';
		if (t) {
			switch (t.type) {
				case 'limits':
					numbers = t.upperFirst
						? value(t.upper) + slash(t.upper) + value(t.lower)
						: `${value(t.lower)}-${value(t.upper)}`;
					break;
				case 'bilateral':
					numbers = '±' + value(t.deviation);
					break;
				case 'deviations':
					numbers =
						formatDeviation(t.upper, true, units, sep) +
						slash(t.upper) +
						formatDeviation(t.lower, false, units, sep);
					break;
				case 'single':
					numbers = t.limit === 'min' ? 'MIN' : 'MAX';
					break;
			}
		}
		const code = spec.fit
			? `${spec.fit.hole.code}/${spec.fit.shaft.code}`
			: (spec.toleranceClass?.code ?? '');
		if (code && numbers) {
			if (spec.classPlacement === 'after') parts.push(numbers, `(${code})`);
			else parts.push(code, `(${numbers})`);
		} else if (code) parts.push(code);
		else if (numbers) parts.push(numbers);
		text += parts.join(' ');
	}
	for (const m of spec.modifiers) text += ' ' + MODIFIERS[m];
	if (spec.thru) text += ' THRU';
	if (spec.depth) text += ' ↧' + value(spec.depth);
	return text;
}

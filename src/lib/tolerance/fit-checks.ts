/*
 * The checks behind a fit's verdict: what the intent asks of the clearances, the clearances
 * stated on the fit, the boundaries, the fastener budget, and the same again at an operating
 * temperature. Each check says what it asked, whether it holds, and the number it read.
 */
import { ZERO, formatLength, toLength, type Length, type Units } from './decimal';
import type { FastenerBudget } from './fastener';
import { exactPlaces } from './feature';
import type { FitIntent } from './fit';

export interface FitCheck {
	what: string;
	ok: boolean;
	text: string;
}

/** A clearance in the hole's unit with at least the hole's places, more where it needs them. */
export function clearanceText(value: Length, units: Units, places: number): string {
	return formatLength(value, units, Math.max(places, exactPlaces(value, units)));
}

/** The numbers a set of checks reads, and how to show them. */
export interface Clearances {
	min: Length | null;
	max: Length | null;
	show: (value: Length) => string;
	/** Put before each check's words ('at 80 °C: '), or ''. */
	prefix: string;
}

function minText(c: Clearances): string {
	return c.min === null ? 'minimum clearance unknown' : `minimum clearance ${c.show(c.min)}`;
}

function isClearanceIntent(intent: FitIntent | null): boolean {
	return (
		intent === 'locational-clearance' ||
		intent === 'floating-fastener' ||
		intent === 'fixed-fastener'
	);
}

/** What the intent itself asks of the clearances. */
export function intentChecks(intent: FitIntent | null, c: Clearances): FitCheck[] {
	if (intent === 'running')
		return [
			{
				what: `${c.prefix}running fit: minimum clearance above zero`,
				ok: c.min !== null && c.min > 0,
				text: minText(c)
			}
		];
	if (isClearanceIntent(intent))
		return [
			{
				what: `${c.prefix}clearance fit: minimum clearance not below zero`,
				ok: c.min !== null && c.min >= 0,
				text: minText(c)
			}
		];
	if (intent === 'interference')
		return [
			{
				what: `${c.prefix}interference fit: maximum clearance not above zero`,
				ok: c.max !== null && c.max <= 0,
				text: c.max === null ? 'maximum clearance unknown' : `maximum clearance ${c.show(c.max)}`
			}
		];
	return [];
}

/** The checks of stated minimum and maximum clearances. */
export function requiredChecks(
	reqMin: Length | undefined,
	reqMax: Length | undefined,
	c: Clearances
): FitCheck[] {
	const checks: FitCheck[] = [];
	if (reqMin !== undefined)
		checks.push({
			what: `${c.prefix}minimum clearance at least ${c.show(reqMin)}`,
			ok: c.min !== null && c.min >= reqMin,
			text: minText(c)
		});
	if (reqMax !== undefined)
		checks.push({
			what: `${c.prefix}maximum clearance at most ${c.show(reqMax)}`,
			ok: c.max !== null && c.max <= reqMax,
			text:
				c.max === null
					? 'maximum clearance unknown (a limit is open)'
					: `maximum clearance ${c.show(c.max)}`
		});
	return checks;
}

/** The least clearance the boundaries must leave: stated, or what the intent implies. */
export function boundaryFloor(intent: FitIntent | null, reqMin: Length | undefined): Length | null {
	if (reqMin !== undefined) return reqMin;
	if (intent === 'running') return toLength(1);
	if (isClearanceIntent(intent)) return ZERO;
	return null;
}

export function boundaryCheck(
	min: Length | null,
	note: string | null,
	floor: Length,
	show: (value: Length) => string
): FitCheck {
	return {
		what: 'assembles at the boundaries (virtual condition, envelope)',
		ok: min !== null && min >= floor,
		text:
			min === null
				? (note ?? 'boundary unknown')
				: `minimum clearance at the boundaries ${show(min)}`
	};
}

export function fastenerCheck(b: FastenerBudget, show: (value: Length) => string): FitCheck {
	const numbers = `H − F = ${show(b.available)}${b.used !== null ? `, position tolerance ${show(b.used)}` : ''}${b.required !== null ? `, hole needed ${show(b.required)}` : ''}`;
	return {
		what: b.holeTooSmall
			? 'fastener: the hole at MMC must not be smaller than the fastener at MMC'
			: b.text,
		ok: b.ok === true,
		text: b.holeTooSmall
			? `H ${show(b.H)} < F ${show(b.F)}: ${numbers}`
			: `${numbers} (${b.boundary})`
	};
}

export function allPass(checks: FitCheck[]): boolean {
	for (let i = 0; i < checks.length; i++) if (!checks[i].ok) return false;
	return true;
}

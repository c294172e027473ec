/*
 * ANSI B4.1 standard fits read from ./tables/ansi-b4-1.ts: hole and shaft limits for a basic
 * size in inches, with the clearances they give. Exact Lengths throughout.
 */
import { add, mulDiv, parseDecimal, sub, type Length } from './decimal';
import { ANSI_B4_1, type AnsiFitClass, type AnsiRow } from './tables/ansi-b4-1';

export type { AnsiFitClass } from './tables/ansi-b4-1';

export const ANSI_FIT_CLASSES = Object.keys(ANSI_B4_1) as AnsiFitClass[];

export interface NotCovered {
	ok: false;
	reason: string;
}

export interface AnsiMember {
	/** ABC designation (H7, g6 …), null where the standard gives none. */
	designation: string | null;
	upperDeviation: Length;
	lowerDeviation: Length;
	upper: Length;
	lower: Length;
	/** The deviations as printed, in thousandths of an inch. */
	thousandths: { upper: string; lower: string };
}

export interface AnsiFit {
	ok: true;
	cls: AnsiFitClass;
	kind: 'clearance' | 'transition' | 'interference';
	/** The table row: over `over`, up to and including `upTo` (inches). */
	sizeRange: { over: Length; upTo: Length };
	hole: AnsiMember;
	shaft: AnsiMember;
	/** Hole lower − shaft upper; negative means interference. */
	minClearance: Length;
	/** Hole upper − shaft lower; negative means interference. */
	maxClearance: Length;
	/** The fit pair exactly as the table prints it (thousandths). */
	published: { low: string; high: string };
}

function inches(text: string): Length {
	const parsed = parseDecimal(text, 'in');
	if (parsed === null) throw new Error(`bad table value ${text}`);
	return parsed.value;
}

/** Thousandths of an inch as printed ('+0.25', '-1.6', '0') to an exact Length. */
export function thousandths(text: string): Length {
	// Read as inches, then divide by 1000: exact, as printed values have at most three places.
	const parsed = parseDecimal(text, 'in');
	if (parsed === null || parsed.value % 1000 !== 0) throw new Error(`bad table value ${text}`);
	return mulDiv(parsed.value, 1, 1000, 'nearest');
}

function findRow(rows: readonly AnsiRow[], size: Length): AnsiRow | undefined {
	return rows.find((row) => size > inches(row[0]) && size <= inches(row[1]));
}

function member(
	designation: string | null,
	size: Length,
	upper: string,
	lower: string
): AnsiMember {
	const upperDeviation = thousandths(upper);
	const lowerDeviation = thousandths(lower);
	return {
		designation,
		upperDeviation,
		lowerDeviation,
		upper: add(size, upperDeviation),
		lower: add(size, lowerDeviation),
		thousandths: { upper, lower }
	};
}

/** Hole and shaft limits of an ANSI B4.1 class (RC1–RC9, LC1–LC11, LT1–LT6, LN1–LN3, FN1–FN5). */
export function ansiFit(cls: AnsiFitClass, basicSize: Length): AnsiFit | NotCovered {
	const table = ANSI_B4_1[cls];
	if (!table) return { ok: false, reason: `not covered: '${cls}' is not an ANSI B4.1 fit class` };
	if (!Number.isSafeInteger(basicSize) || basicSize <= 0) {
		return { ok: false, reason: 'not covered: ANSI B4.1 sizes start above 0 in' };
	}
	const row = findRow(table.rows, basicSize);
	if (!row) {
		const first = table.rows[0];
		const last = table.rows[table.rows.length - 1];
		const reason =
			basicSize <= inches(first[0])
				? `not covered: ${cls} is tabulated over ${first[0]} in only`
				: `not covered: ${cls} is held here up to ${last[1]} in (larger sizes are in the standard but not in these tables)`;
		return { ok: false, reason };
	}
	const [over, upTo, low, high, holeUpper, holeLower, shaftUpper, shaftLower] = row;
	const hole = member(table.hole, basicSize, holeUpper, holeLower);
	const shaft = member(table.shaft, basicSize, shaftUpper, shaftLower);
	return {
		ok: true,
		cls,
		kind: table.kind,
		sizeRange: { over: inches(over), upTo: inches(upTo) },
		hole,
		shaft,
		minClearance: sub(hole.lowerDeviation, shaft.upperDeviation),
		maxClearance: sub(hole.upperDeviation, shaft.lowerDeviation),
		published: { low, high }
	};
}

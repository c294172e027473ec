/*
 * The rulebook's catalogue: what each rule checks, explained for a practising checker. Clause
 * numbers were recalled from memory, not read from the standards; each is marked "(recalled)"
 * until someone checks it against the published text.
 */
import type { RuleCode, Severity } from './types';

export interface RuleExplanation {
	code: RuleCode;
	title: string;
	/** The default severity; `severities` when it depends on the cause. */
	severity: Severity;
	severities?: { cause: string; severity: Severity; when: string }[];
	/** One line for lists. */
	summary: string;
	checks: string;
	why: string;
	example: string;
	fix: string;
	clause: string;
}

export const ADVISORY =
	'Rulebook results are advisory: the governing standard, your organisation’s drawing practice and a qualified checker decide.';

export const FAMILIES: { prefix: string; name: string }[] = [
	{ prefix: 'LIM', name: 'Limits of size' },
	{ prefix: 'ENV', name: 'Envelope and governing standard' },
	{ prefix: 'GEO', name: 'Geometric tolerances' },
	{ prefix: 'FIT', name: 'Fits' },
	{ prefix: 'DOC', name: 'Drawing notes and notation' }
];

const RULES: RuleExplanation[] = [
	{
		code: 'LIM-01',
		title: 'Feature of size without limits',
		severity: 'critical',
		summary: 'A feature of size has no limits, and no general tolerance covers its size.',
		checks:
			'Every feature of size must end up with two limits: written on the callout, from an ISO 286 class, or from the general tolerance the drawing states. The rule fires when none of these gives limits — a size given only as a reference dimension, or as a basic dimension that no profile tolerance controls, a size outside the range the general tolerance covers (ISO 2768-1 starts at 0.5 mm), a number of decimal places the title block gives no tolerance for, or a callout that cannot be read.',
		why: 'A size without limits cannot be accepted or rejected. The supplier will pick a tolerance, the inspector another, and the mating part was designed against a third.',
		example:
			'A seal groove width written as (2.4) — a reference dimension — on an ISO 2768-m drawing. Reference dimensions carry no tolerance and the general tolerance does not apply to them, so the groove has no limits at all.',
		fix: 'Give the size a tolerance (limits, ± or an ISO 286 class), or make sure the general tolerance covers it.',
		clause:
			'ASME Y14.5-2018 §4 fundamental rules, rule (a) (recalled); ASME Y14.5-2009 §1.4(a) (recalled); ISO 8015:2011 §5.3 definitive drawing (recalled); ISO 2768-1:1989 §1 scope (recalled)'
	},
	{
		code: 'LIM-02',
		title: 'Limits inverted or of zero width',
		severity: 'critical',
		severities: [
			{ cause: 'zero-width', severity: 'critical', when: 'the limits leave no zone' },
			{ cause: 'unreadable', severity: 'critical', when: 'the limits cannot be read' },
			{
				cause: 'inverted',
				severity: 'minor',
				when: 'deviations written the wrong way round that still give a valid zone'
			}
		],
		summary: 'The upper and lower limits are the wrong way round or equal.',
		checks:
			'The stated tolerance leaves no zone: both limits equal, a ± of zero, or deviations written so that the one in the upper place is below the one in the lower place (25 −0.01/+0.02).',
		why: 'A zone of zero width cannot be made or measured, and inverted deviations usually mean the drafter swapped the signs — the part made to the text is not the part designed.',
		example:
			'Ø25 +0.01/+0.03: the deviation written on top (+0.01) is smaller than the one written below (+0.03). Read literally the zone runs from 25.030 down to 25.010; the designer most likely meant 25.010–25.030 but the callout does not say so.',
		fix: 'Write the larger limit or deviation on top, and give the size a zone of non-zero width.',
		clause:
			'ASME Y14.5-2018 §5 tolerancing of size (recalled); ASME Y14.5-2009 §2.2 (recalled); ISO 14405-1:2016 §5 (recalled)'
	},
	{
		code: 'LIM-03',
		title: 'Unequal decimal places (ASME)',
		severity: 'minor',
		summary: 'ASME drawings: a limit pair or ± tolerance written with unequal decimal places.',
		checks:
			'On ASME Y14.5 drawings, both limits of a limit dimension, and both values of a bilateral tolerance, carry the same number of decimal places. On inch drawings the size also carries the same places as its tolerance. ISO drawings follow other conventions and are not checked.',
		why: 'On an inch drawing the places written are read as a statement of precision; .250–.2515 looks like a typing slip and invites the shop to query or to guess.',
		example:
			'Pivot hole Ø.250–.2515: the lower limit has 3 places, the upper 4. Written .2500–.2515 the callout says the same thing unambiguously.',
		fix: 'Add trailing zeros so both values carry the same number of places.',
		clause:
			'ASME Y14.5-2018 §4 units and decimal places (recalled); ASME Y14.5-2009 §1.6 and §2.3 (recalled)'
	},
	{
		code: 'LIM-04',
		title: 'ISO 286 code in conflict',
		severity: 'major',
		summary:
			'An ISO 286 code whose stated limits disagree with it, that is undefined at that size, or whose letter case contradicts hole/shaft.',
		checks:
			'Where a callout gives an ISO 286 tolerance class, the class must exist at that nominal size, its letter case must match the feature (capital for a hole, small for a shaft), and limits written beside it must be the limits the class gives, exactly or rounded inward to the places written (the lower limit up, the upper down), never outward. For js and JS the exact ±IT/2 and the rounded values ISO 286-1 allows for odd IT values both agree.',
		why: 'Two statements of the same tolerance that disagree leave the shop to choose; a capital letter on a shaft gives a completely different zone.',
		example:
			'Ø25 H7 (25.000/25.025): ISO 286-2 gives H7 at 25 mm as 0/+0.021, so the written upper limit 25.025 disagrees with the class by 0.004.',
		fix: 'Correct the limits to match the class (or drop one of the two statements), and use the letter case of the feature.',
		clause: 'ISO 286-1:2010 §4 and ISO 286-2:2010 tables (recalled)'
	},
	{
		code: 'LIM-05',
		title: 'Single limit on a fit member',
		severity: 'critical',
		severities: [
			{ cause: 'mmc-side', severity: 'critical', when: 'the MMC side is missing' },
			{ cause: 'lmc-side', severity: 'major', when: 'the LMC side is missing' }
		],
		summary: 'A MIN or MAX size on a feature that takes part in a fit.',
		checks:
			'A size given by one limit only (25 MIN, Ø6.5 MAX) is allowed where the other side does not matter, but not on a member of a fit. Missing on the MMC side (a hole with only a MAX, a shaft with only a MIN), assembly is not guaranteed; missing on the LMC side, the looseness of the fit has no bound.',
		why: 'The fit is computed from both limits of both members; with one open the worst case is unknown.',
		example:
			'A bearing seat Ø20 MIN in a running fit: the shaft may be any size above 20.000, so the minimum clearance with a Ø20 H7 hole is unbounded below — it may not assemble at all.',
		fix: 'Give the fit member both limits.',
		clause:
			'ASME Y14.5-2018 §5 single limits (recalled); ASME Y14.5-2009 §2.2 (recalled); ISO 286-1:2010 §3.3 fits (recalled)'
	},
	{
		code: 'LIM-06',
		title: 'Tolerance tighter than the shop holds',
		severity: 'note',
		summary: "A size tolerance tighter than the team's stated capability (IT grade).",
		checks:
			'The team may state the finest IT grade its shops hold as routine. A size tolerance smaller than the standard tolerance of that grade at the feature’s nominal size is noted.',
		why: 'Tolerances tighter than the process holds cost inspection, scrap and concessions. Sometimes they are needed; then the note is a reminder to agree the process.',
		example:
			'Team capability IT7. A Ø12 size written 12.000–12.008 has a tolerance of 0.008; ISO 286-1 gives IT7 at 12 mm as 0.018 and IT5 as 0.008, so the size asks for about IT5.',
		fix: 'Open the tolerance to what the function needs, or agree the process with the shop.',
		clause: 'ISO 286-1:2010 table 1, standard tolerance grades (recalled)'
	},
	{
		code: 'ENV-01',
		title: 'Form tolerance refines nothing',
		severity: 'minor',
		summary:
			'A surface form tolerance not smaller than the size tolerance, on a feature under the envelope.',
		checks:
			'Under the envelope (ASME Rule #1, or Ⓔ on an ISO drawing) the size limits already hold form within the size tolerance. A circularity, cylindricity, surface straightness or flatness on the same feature only adds something when it is smaller than the size tolerance. Derived median line or plane controls, free state, Ⓘ, stock, and ISO features without Ⓔ are not checked: there the form control is the only limit on form.',
		why: 'A form tolerance that the size limits already enforce is noise on the drawing, and often a sign that the designer expected it to allow more form error than the envelope lets through — which it does not.',
		example:
			'Tab thickness .250 ±.005 (size tolerance .010) with a flatness of .015 on an ASME drawing. Under Rule #1 the form must be perfect at MMC, and the flatness error may grow only as the tab departs from MMC, reaching the size tolerance .010 at LMC, so the .015 flatness never governs.',
		fix: 'Make the form tolerance smaller than the size tolerance, remove it, or lift the envelope where more form error is acceptable.',
		clause:
			'ASME Y14.5-2018 §5 limits of size, Rule #1 (recalled); ASME Y14.5-2009 §2.7.1 (recalled); ISO 14405-1:2016 envelope requirement (recalled)'
	},
	{
		code: 'ENV-02',
		title: 'ISO fit member with no envelope',
		severity: 'major',
		summary:
			'A fit member on an ISO 8015 drawing where nothing bounds the mating envelope (no Ⓔ, no -E, no boundary-making tolerance).',
		checks:
			'Under ISO 8015 size and form are independent: the size limits are checked point to point and say nothing about the envelope the mating part sees. A member of a fit needs something to bound it — Ⓔ on the size, a general note such as ISO 2768-mK-E, or a geometric tolerance that makes a boundary (typically a position or straightness at MMC).',
		why: 'Without a bound, a bore can be banana-shaped or lobed while every two-point size is inside H7, and the shaft that was computed to fit will not go in.',
		example:
			'Bushing bore Ø12 H7 (12.000–12.018) without Ⓔ: a bore bent by 0.03 along its length still passes every two-point check, but its mating envelope is about 11.97 — smaller than a g6 journal at 11.994.',
		fix: 'Add Ⓔ to the size (Ø12 H7 Ⓔ), or a geometric tolerance at MMC that bounds it.',
		clause: 'ISO 8015:2011 §5.5 independency (recalled); ISO 14405-1:2016 Ⓔ (recalled)'
	},
	{
		code: 'ENV-03',
		title: 'Rule #1 lifted on a fit member',
		severity: 'major',
		summary:
			'A fit member whose Rule #1 is lifted (Ⓘ, stock, free state) with nothing else bounding its mating envelope.',
		checks:
			'On an ASME drawing Rule #1 bounds every regular feature of size by perfect form at MMC. Where it is lifted — Ⓘ, the note PERFECT FORM AT MMC NOT REQD, stock as furnished, free state — a fit member needs another boundary, such as a straightness of the median line or a position at MMC.',
		why: 'The fit was computed assuming the envelope; with it gone, form error adds to the size and the worst case no longer assembles.',
		example:
			'A pin Ø.2495–.2500 Ⓘ in a running fit with a hole at .2510 MMC: with Rule #1 lifted the pin may bow by more than the .0010 allowance and bind.',
		fix: 'Remove the exemption, or add a geometric tolerance at MMC that makes a virtual condition.',
		clause:
			'ASME Y14.5-2018 §5 Rule #1 and its exceptions (recalled); ASME Y14.5-2009 §2.7.1–2.7.3 (recalled)'
	},
	{
		code: 'ENV-04',
		title: 'No governing standard',
		severity: 'major',
		severities: [
			{ cause: 'undetermined', severity: 'major', when: 'nothing says which system applies' },
			{
				cause: 'iso-assumed',
				severity: 'minor',
				when: 'ISO GPS notation shows, so ISO 8015 is assumed'
			}
		],
		summary: 'The drawing does not state its governing standard.',
		checks:
			'A drawing must say whether it follows ASME Y14.5 or ISO GPS, because the two read the same callout differently (envelope or independency). Where ISO GPS notation appears anyway — ISO 286 classes, Ⓔ, an ISO 2768 note — ISO 8015 invokes itself, and the rule says so at lower severity.',
		why: 'Ø10 h6 with a cylindricity means one thing under Rule #1 and another under independency; the shop cannot know which.',
		example:
			'A drawing with Ø20 H7 and ISO 2768-m in the title block but no standard stated: ISO 8015 applies by invocation, so sizes are two-point and the envelope is not required.',
		fix: 'State the governing standard in the title block (ISO 8015 or ASME Y14.5-2018).',
		clause: 'ISO 8015:2011 §5.1 invocation (recalled); ASME Y14.5-2018 §1.1 (recalled)'
	},
	{
		code: 'GEO-01',
		title: 'Material modifier without a size',
		severity: 'critical',
		summary: 'An MMC or LMC modifier in the tolerance of a feature that has no size.',
		checks:
			'Ⓜ and Ⓛ refer to the material condition of a feature of size. On a feature without two limits — a surface, a basic or reference dimension — there is no MMC or LMC to refer to.',
		why: 'The modifier cannot be evaluated, so the tolerance has no defined meaning and the gauge cannot be designed.',
		example:
			'A position Ø0.1 Ⓜ on a feature dimensioned only as (8): no limits, so no MMC and no virtual condition.',
		fix: 'Remove the modifier, or give the feature limits of size.',
		clause:
			'ASME Y14.5-2018 §3 definitions of MMC and LMC (recalled); ASME Y14.5-2009 §1.3 (recalled); ISO 2692:2014 §4 (recalled)'
	},
	{
		code: 'GEO-02',
		title: 'Material modifier not allowed here',
		severity: 'critical',
		summary:
			'Ⓜ or Ⓛ on circularity, cylindricity, surface straightness or flatness, run-out, profile, or (2009) concentricity/symmetry.',
		checks:
			'Circularity, cylindricity, surface straightness and flatness, run-out and profile control surface elements, not a derived axis or centre plane of a feature of size, so MMC and LMC cannot apply to their tolerance value. Concentricity and symmetry of ASME Y14.5-2009 control the median points of a feature and apply regardless of feature size only.',
		why: 'The drawing asks for something that cannot be inspected as written; the shop will either ignore the modifier or query it.',
		example:
			'Cylindricity 0.01 Ⓜ on Ø12 g6: cylindricity is a surface control; the Ⓜ has no meaning.',
		fix: 'Remove the modifier, or use a control of the derived feature (straightness of the median line, position).',
		clause:
			'ASME Y14.5-2018 §8 form (recalled); ASME Y14.5-2009 §5.4 and §7.6 (recalled); ISO 2692:2014 §4 (recalled)'
	},
	{
		code: 'GEO-03',
		title: 'Zero tolerance regardless of size',
		severity: 'major',
		summary: 'A geometric tolerance of zero without Ⓜ or Ⓛ.',
		checks:
			'A geometric tolerance of 0 is useful only at MMC or LMC, where the tolerance grows with the departure from that condition. Regardless of feature size a zero zone allows no deviation at all.',
		why: 'No part can be made to a zero zone; every part made will be rejected or accepted on concession.',
		example: 'Position Ø0 A B on Ø6.6 holes without Ⓜ: nothing can meet it.',
		fix: 'Add Ⓜ (zero tolerancing at MMC) or give a tolerance value above zero.',
		clause:
			'ASME Y14.5-2018 §10 location, zero positional tolerance at MMC (recalled); ISO 2692:2014 (recalled)'
	},
	{
		code: 'GEO-04',
		title: 'Datum letter undefined or not allowed',
		severity: 'major',
		summary: 'A datum letter referenced but never defined, or I, O or Q used as a datum letter.',
		checks:
			'Every datum letter in a feature control frame must be defined by a datum feature symbol on the drawing. On ASME Y14.5 drawings the letters I, O and Q are not used because they are read as digits; ISO 5459 has no such ban.',
		why: 'A tolerance referencing an undefined datum has no reference frame; the inspector cannot set the part up.',
		example: 'Position Ø0.2 Ⓜ A B C on a drawing where only A and B are defined.',
		fix: 'Define the datum on the drawing, or reference one that is.',
		clause:
			'ASME Y14.5-2018 §6 datum feature symbol and §7 datums (recalled); ASME Y14.5-2009 §3.3.2 (recalled); ISO 5459:2011 §6 (recalled)'
	},
	{
		code: 'FIT-01',
		title: 'Not enough clearance at MMC',
		severity: 'critical',
		summary: 'Minimum clearance at MMC below the required minimum for the fit’s intent.',
		checks:
			'Hole MMC minus shaft MMC is the least clearance the size limits allow. A running fit needs it above zero; a locational clearance fit or floating fastener needs it at least zero; a stated required minimum replaces the default.',
		why: 'At the worst case — both parts at maximum material — a running fit with no allowance runs dry or seizes, and a clearance fit does not assemble.',
		example:
			'Pivot hole .2500–.2515 and pin .2490–.2500 in a running fit: MMC hole .2500 − MMC pin .2500 = .0000, but a running fit needs more than zero.',
		fix: 'Open the hole or reduce the shaft so the MMCs give the allowance the fit needs (e.g. an RC class or an H/g fit).',
		clause: 'ISO 286-1:2010 §3.3 fits (recalled); ASME B4.1-1967 (R2009) §2 (recalled)'
	},
	{
		code: 'FIT-02',
		title: 'Fit fails at the boundaries',
		severity: 'critical',
		summary:
			'A fit that fails at the virtual conditions or boundaries once geometric tolerances apply.',
		checks:
			'Where geometric tolerances make boundaries (virtual condition at MMC, inner and outer boundaries regardless of size), the clearance that matters for assembly is between those boundaries, not between the sizes. The rule fires when the sizes alone would assemble but the boundaries do not. For one pin in one hole only the controls that bound the mating envelope count: form controls such as straightness of the derived median line or flatness of the derived median plane. Orientation and location controls (perpendicularity to A, position) relate a feature to its datums, not to its mate, and count only when the fit says both members are located by the same datum features.',
		why: 'A straightness or position at MMC that exceeds the allowance lets a part at the limits of its tolerances sit outside the other part’s envelope.',
		example:
			'Journal Ø12 g6 (11.983–11.994) with straightness of the median line Ø0.02 Ⓜ: virtual condition 11.994 + 0.020 = 12.014, against the bushing’s MMC 12.000 gives −0.014 — interference in a running fit.',
		fix: 'Reduce the geometric tolerance (or use zero at MMC), or increase the allowance between the sizes.',
		clause:
			'ASME Y14.5-2018 §3 definition of virtual condition (recalled); ASME Y14.5-2009 §1.3 (recalled); ISO 2692:2014 maximum material virtual size (recalled)'
	},
	{
		code: 'FIT-03',
		title: 'Interference fit can have clearance',
		severity: 'major',
		summary: 'A fit meant as interference whose limits allow clearance.',
		checks:
			'For an interference fit the largest clearance (hole LMC − shaft LMC) must not be above zero. If it is, the pair is a transition fit and some assemblies will be loose.',
		why: 'A pressed bushing that can be loose turns in its housing.',
		example:
			'Ø3 H7/p6: ISO 286-2 gives H7 0/+0.010 and p6 +0.006/+0.012 at 3 mm, so LMC hole 3.010 − LMC shaft 3.006 = +0.004: a transition fit, not interference.',
		fix: 'Choose a shaft position further from zero (r6, s6) or a tighter hole grade.',
		clause: 'ISO 286-1:2010 §3.3.4–3.3.5 (recalled); ISO 286-2:2010 tables (recalled)'
	},
	{
		code: 'FIT-04',
		title: 'Clearance above the stated maximum',
		severity: 'major',
		summary: 'The largest clearance of the fit exceeds the stated maximum.',
		checks:
			'Where the fit has a required maximum clearance, hole LMC − shaft LMC must not exceed it.',
		why: 'Too much play means noise, wear, poor location or leakage — whatever made the designer state the limit.',
		example:
			'Ø12 H8/f7 with a required maximum clearance of 0.060: H8 +0.027 and f7 −0.016/−0.034 give 12.027 − 11.966 = 0.061.',
		fix: 'Tighten one of the tolerances, or shift the shaft position closer to zero.',
		clause: 'ISO 286-1:2010 §3.3 (recalled)'
	},
	{
		code: 'FIT-05',
		title: 'Fastener position budget exceeded',
		severity: 'critical',
		summary:
			'A fastener pattern whose position tolerances exceed H − F (or the projected-zone budget).',
		checks:
			'Floating fasteners (bolts through clearance holes in both parts): each part’s position tolerance T must not exceed H − F. Fixed fasteners (studs, press-fit pins): T₁ + T₂ must not exceed H − F; where the fixed part’s tolerance is not projected, the hole must be at least F + T₁ + T₂(1 + 2P/D). T₂ is the position tolerance of the hole that holds the fastener, given as a number or read from that hole’s feature. The formulas are those of a position at MMC, whose boundary is the virtual condition MMC − t; regardless of feature size the inner boundary is the same MMC − t (no bonus); at LMC it is MMC − t − T, so the clearance hole’s share is t + T (T its size tolerance). A clearance hole smaller than the fastener at MMC (H − F below zero) fails whatever the position tolerances.',
		why: 'The formula is the worst case: two parts at the limits of position and size still let every fastener through.',
		example:
			'M6 bolts (F = 6.0) through Ø6.6 ±0.2 holes: H = 6.4, so H − F = 0.4. A position Ø0.5 Ⓜ would not assemble at worst case.',
		fix: 'Reduce the position tolerance, or enlarge the clearance hole.',
		clause:
			'ASME Y14.5-2018 Appendix B, formulas for positional tolerancing (recalled); -2009 Appendix B (recalled)'
	},
	{
		code: 'FIT-06',
		title: 'Fit member not located',
		severity: 'minor',
		summary: 'A fit member with no orientation or location control.',
		checks:
			'A member of a fit needs a control that relates it to the rest of the part — position, perpendicularity, run-out and the like. A general geometric tolerance does not do it: an ISO 2768-2 class (H, K or L) gives general straightness, perpendicularity, symmetry and run-out but no position, so it locates nothing. A datum feature itself is exempt, and so is a member bought out to a standard (a dowel pin, a bushing), which its standard and its own fit locate.',
		why: 'The fit computed from sizes assumes both members on a common axis; without a location control their axes may be anywhere the ± dimensions allow.',
		example:
			'A pivot hole located only by a 1.250 ±.005 dimension with no perpendicularity to the tab face.',
		fix: 'Add a position or orientation tolerance to the appropriate datums.',
		clause:
			'ASME Y14.5-2018 §9 orientation and §10 location (recalled); ISO 1101:2017 §18 (recalled); ISO 2768-2:1989 (withdrawn 2021)'
	},
	{
		code: 'DOC-01',
		title: 'General tolerance not stated',
		severity: 'major',
		summary: 'Features rely on a general tolerance that the drawing does not state.',
		checks:
			'A size written without a tolerance takes the general tolerance of the drawing. If the drawing states none, the size has no limits.',
		why: 'The shop reads its own default, the inspector another; neither is what the designer assumed.',
		example: 'A slot width 8 on a drawing with no ISO 2768 note and no title-block tolerance.',
		fix: 'State the general tolerance in the title block (for example ISO 2768-m, or .XX ±.01 .XXX ±.005), or tolerance the size.',
		clause:
			'ISO 2768-1:1989 §5 indication on drawings (recalled); ASME Y14.5-2018 §4 fundamental rules (recalled); ASME Y14.5-2009 §1.4(a) (recalled)'
	},
	{
		code: 'DOC-02',
		title: 'Notation inconsistent with the standard',
		severity: 'minor',
		summary:
			'Notation inconsistent with the stated edition or system (e.g. concentricity on Y14.5-2018, Ⓘ on an ISO drawing, a withdrawn ISO 2768-2 reference).',
		checks:
			'Symbols and notes must belong to the stated system and edition: concentricity and symmetry were removed in Y14.5-2018; Ⓘ is ASME notation (ISO is independent by default); Ⓔ and the ISO 14405 modifiers belong to ISO; ISO 2768-2 was withdrawn in 2021 and replaced by ISO 22081.',
		why: 'Notation from another system is read differently by different shops, and a withdrawn reference may not be available to the supplier.',
		example: 'The note ISO 2768-mK cites the geometric class K of ISO 2768-2, withdrawn in 2021.',
		fix: 'Use the notation of the stated standard (position or profile instead of concentricity; ISO 22081 general specifications instead of ISO 2768-2).',
		clause:
			'ASME Y14.5-2018 §1.1 and Appendix (changes from 2009) (recalled); ISO 22081:2021 (recalled); ISO 8015:2011 §5.5 (recalled)'
	}
];

export const CATALOGUE: readonly RuleExplanation[] = RULES;

const BY_CODE = new Map<string, RuleExplanation>(RULES.map((r) => [r.code, r]));

export function ruleExplanation(code: string): RuleExplanation | undefined {
	return BY_CODE.get(code.toUpperCase());
}

/** The severity a result carries: the team's override, else the rule's default for the cause. */
export function defaultSeverity(code: RuleCode, cause?: string): Severity {
	const rule = BY_CODE.get(code) as RuleExplanation;
	return rule.severities?.find((s) => s.cause === cause)?.severity ?? rule.severity;
}

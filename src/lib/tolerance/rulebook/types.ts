import type { Length, Units } from '../decimal';
import type {
	FeatureOverrides,
	GeneralTolerance,
	GeometricControl,
	GoverningStandard
} from '../feature';
import type { FitIntent, TemperatureInput } from '../fit';
import type { Grade } from '../iso286';
import type { RulebookIndex } from './evaluate';

export const RULE_CODES = [
	'LIM-01',
	'LIM-02',
	'LIM-03',
	'LIM-04',
	'LIM-05',
	'LIM-06',
	'ENV-01',
	'ENV-02',
	'ENV-03',
	'ENV-04',
	'GEO-01',
	'GEO-02',
	'GEO-03',
	'GEO-04',
	'FIT-01',
	'FIT-02',
	'FIT-03',
	'FIT-04',
	'FIT-05',
	'FIT-06',
	'DOC-01',
	'DOC-02'
] as const;

export type RuleCode = (typeof RULE_CODES)[number];

export type Severity = 'critical' | 'major' | 'minor' | 'note';

export type FeatureKind =
	'hole' | 'bore' | 'pin' | 'shaft' | 'slot' | 'tab' | 'width' | 'thread' | 'other';

export interface RulebookDrawing {
	units: Units;
	standard: GoverningStandard;
	generalTolerance: GeneralTolerance | null;
	notes?: string;
	/** Datum letters defined on the drawing by features that are not features of size (faces). */
	datums?: string[];
}

export interface RulebookFeature {
	id: string;
	balloon?: number | null;
	label?: string;
	kind: FeatureKind;
	internal: boolean;
	callout: string;
	quantity?: number | null;
	controls?: GeometricControl[];
	overrides?: FeatureOverrides;
	/** The datum letter this feature defines, if it is a datum feature. */
	datumFeature?: string;
	notes?: string;
	/**
	 * The drawing this feature sits on, when it is not the drawing judged: a fit member on
	 * another drawing is read and judged under its own units, standard and general tolerance.
	 */
	drawing?: RulebookDrawing;
	/** Bought to a standard (a dowel pin, a bushing): not asked for a location control (FIT-06). */
	boughtOut?: boolean;
}

export interface RulebookFastener {
	callout: string;
	label?: string;
	/** Position tolerance at the end that fixes a fixed fastener (T₂), in the drawing's unit. */
	fixedPosition?: string;
	projection?: { P: string; D: string };
}

export interface RulebookFit {
	id: string;
	holeFeatureId: string;
	shaftFeatureId?: string | null;
	fastener?: RulebookFastener | null;
	intent: FitIntent;
	/**
	 * A fixed fastener's holding hole (tapped or press-fit) as a feature: T₂ is its position
	 * tolerance. `fastener.fixedPosition` gives T₂ as a number instead.
	 */
	fixedHoleFeatureId?: string | null;
	/** Both members are located by the same datum features (see ../mating.ts). Default false. */
	sharedDatumFrame?: boolean;
	/** The operating temperature and the members' expansion coefficients, when it matters. */
	temperature?: TemperatureInput | null;
	requiredMinClearance?: string | null;
	requiredMaxClearance?: string | null;
}

export interface RulebookTeam {
	severityOverrides?: Partial<Record<RuleCode, Severity>>;
	/** The finest IT grade the team's shops hold as a matter of course, e.g. 'IT6' (LIM-06). */
	capabilityGrade?: Grade | null;
}

export interface RulebookInput {
	drawing: RulebookDrawing;
	features: readonly RulebookFeature[];
	fits: readonly RulebookFit[];
	team?: RulebookTeam;
	/** Judge only these (plus the fits that reference the features, and those fits' members). */
	only?: { featureIds?: readonly string[]; fitIds?: readonly string[]; drawing?: boolean };
	/** From `indexRulebook(features, fits)`: makes a run limited by `only` cost what it touches. */
	index?: RulebookIndex;
}

/** One number behind a result: exact when it is a length, always shown as text. */
export interface ResultValue {
	name: string;
	text: string;
	length: Length | null;
}

export interface RuleResult {
	/** Stable across runs for one cause: rule, subject and cause. */
	key: string;
	rule: RuleCode;
	severity: Severity;
	subject: 'drawing' | 'feature' | 'fit';
	featureId: string | null;
	fitId: string | null;
	/** Short machine word for what in the subject is wrong (e.g. 'mmc-side', 'position'). */
	cause: string;
	/** What is wrong, in one sentence. */
	message: string;
	values: ResultValue[];
	/** The numbers in one readable line. */
	line: string;
	fix: string;
	clause: string;
}

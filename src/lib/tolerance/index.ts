export * from './decimal';
export * from './callout-types';
export { parseCallout, calloutLimits } from './callout';
export { formatCallout, formatWrittenValue } from './callout-format';
export {
	isoLimits,
	isoFit,
	standardTolerance,
	parseIsoCode,
	parseGrade,
	classifyFit,
	GRADES,
	SHAFT_POSITIONS,
	HOLE_POSITIONS
} from './iso286';
export type {
	IsoLimits,
	IsoLimitsResult,
	IsoFit,
	FitClassification,
	Grade,
	NotDefined
} from './iso286';
export {
	generalLinearTolerance,
	brokenEdgeTolerance,
	angularTolerance,
	generalStraightnessFlatness,
	generalPerpendicularity,
	generalSymmetry,
	generalCircularRunout,
	ISO_2768_2_STATUS,
	LINEAR_CLASSES,
	GEOMETRIC_CLASSES
} from './iso2768';
export type {
	LinearClass,
	GeometricClass,
	GeneralLinear,
	GeneralGeometric,
	GeneralAngular,
	NotCovered
} from './iso2768';
export { titleBlockTolerance, titleBlockAngle } from './title-block';
export type { DecimalPlacesTolerance, TitleBlockTolerance, TitleBlockAngle } from './title-block';
export { ansiFit, ANSI_FIT_CLASSES } from './ansi-fits';
export type { AnsiFit, AnsiFitClass, AnsiMember } from './ansi-fits';
export {
	evaluateFeature,
	controlBoundaries,
	bonusTolerance,
	effectiveStandard,
	isSurfaceForm,
	exactPlaces,
	CHARACTERISTICS,
	MATERIAL_MODIFIERS
} from './feature';
export { GOVERNING_STANDARDS, STANDARDS, isAsme } from './drawing-context';
export type { DrawingContext, Iso2768General } from './drawing-context';
export type {
	FeatureInput,
	FeatureResult,
	FeatureEvaluation,
	FeatureError,
	FeatureOverrides,
	GeometricControl,
	Characteristic,
	MaterialModifier,
	ControlEvaluation,
	Boundaries,
	GoverningStandard,
	GeneralTolerance
} from './feature';
export { evaluateFit, FIT_INTENTS } from './fit';
export type {
	FitInput,
	FitResult,
	FitEvaluation,
	FitError,
	FitIntent,
	FitMemberInput,
	FastenerInput,
	FastenerBudget,
	TemperatureInput
} from './fit';
export { adviseFit, PREFERRED_FITS } from './fit-advisor';
export type {
	AdviseInput,
	AdviseResult,
	FitProposal,
	FitWanted,
	PreferredFit
} from './fit-advisor';
export { fitDiagramSvg } from './fit-diagram';
export {
	evaluate as evaluateRulebook,
	scopeOf as rulebookScope,
	indexRulebook,
	CATALOGUE as RULE_CATALOGUE,
	ADVISORY,
	ruleExplanation,
	RULE_CODES
} from './rulebook';
export type {
	RuleCode,
	RuleResult,
	ResultValue,
	RuleExplanation,
	RulebookDrawing,
	RulebookFeature,
	RulebookFit,
	RulebookFastener,
	RulebookInput,
	RulebookIndex,
	RulebookTeam,
	Severity
} from './rulebook';

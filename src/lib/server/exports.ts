/*
 * The features and fits tables of a revision as CSV: the same values the JSON API answers
 * (strings as they are, booleans as true/false, nothing as an empty cell).
 */
import { featuresOf, type FeaturePlace } from './features';
import { memberName } from '$lib/fits';
import { fitsOf, type FitPlace } from './fits';
import { csvResponse, toCsv } from './csv';
import type { Db } from './db/connect';

export const featureColumns = [
	'id',
	'balloon',
	'label',
	'kind',
	'internal',
	'boughtOut',
	'datumFeature',
	'callout',
	'quantity',
	'canonical',
	'upper',
	'lower',
	'tolerance',
	'mmc',
	'lmc',
	'envelope',
	'virtualCondition',
	'findings',
	'placed',
	'problem',
	'notes',
	'version'
] as const;

export async function featuresCsv(db: Db, place: FeaturePlace) {
	const rows = (await featuresOf(db, place)).map((f) => [
		f.id,
		f.balloon,
		f.label,
		f.kind,
		f.internal,
		f.boughtOut,
		f.datumFeature,
		f.callout,
		f.quantity,
		f.canonical,
		f.upper,
		f.lower,
		f.tolerance,
		f.mmc,
		f.lmc,
		f.envelope?.applies,
		f.virtualCondition,
		f.findings.length,
		f.location !== null,
		f.problem?.message,
		f.notes,
		f.version
	]);
	return toCsv([...featureColumns], rows);
}

export const fitColumns = [
	'id',
	'owned',
	'hole',
	'holeCallout',
	'other',
	'otherCallout',
	'intent',
	'requiredMinClearance',
	'requiredMaxClearance',
	'sharedDatumFrame',
	'operatingTemperature',
	'minClearance',
	'maxClearance',
	'classification',
	'minClearanceAtBoundary',
	'maxClearanceAtBoundary',
	'countedControls',
	'verdict',
	'problem',
	'version'
] as const;

export async function fitsCsv(db: Db, place: FitPlace) {
	const rows = (await fitsOf(db, place)).map((f) => [
		f.id,
		f.owned,
		memberName(f.members.hole),
		f.members.hole.callout,
		f.members.shaft ? memberName(f.members.shaft) : f.fastener?.label || 'bought fastener',
		f.members.shaft ? f.members.shaft.callout : f.fastener?.callout,
		f.intent,
		f.requiredMinClearance,
		f.requiredMaxClearance,
		f.sharedDatumFrame,
		f.temperature?.operating,
		f.minClearance,
		f.maxClearance,
		f.classification,
		f.minClearanceAtBoundary,
		f.maxClearanceAtBoundary,
		Array.isArray(f.countedControls) ? f.countedControls.join('; ') : '',
		f.verdict,
		f.problem?.message,
		f.version
	]);
	return toCsv([...fitColumns], rows);
}

export const csvFile = (place: FeaturePlace, table: string, body: string) =>
	csvResponse(`${place.drawing.number}-${place.revision.letter}-${table}.csv`, body);

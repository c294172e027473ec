/*
 * A feature edit that someone else's change overtook: what the person typed, kept aside beside
 * the feature as it stands now, and the draft that puts their values back on top of it. Pure:
 * tested in tests/unit/feature-form.test.ts.
 */
import type { FeatureJson, NewFeature } from '$lib/features';
import { draftOf, type FeatureDraft } from './feature-form';

const names: Record<keyof NewFeature, string> = {
	label: 'Label',
	kind: 'Kind',
	internal: 'Internal or external',
	boughtOut: 'Bought-out part',
	datumFeature: 'Datum feature',
	callout: 'Callout',
	quantity: 'Quantity',
	controls: 'Geometric tolerances',
	overrides: 'Overrides',
	location: 'Place on the sheet',
	notes: 'Notes'
};

function shown(key: keyof NewFeature, value: unknown): string {
	if (value === null || value === undefined || value === '') return '—';
	switch (key) {
		case 'internal':
			return value ? 'internal (hole)' : 'external (shaft)';
		case 'boughtOut':
			return value ? 'yes' : 'no';
		case 'controls': {
			const list = value as { characteristic: string; value: string }[];
			return list.length === 0
				? 'none'
				: list.map((c) => `${c.characteristic} ${c.value}`).join(', ');
		}
		case 'overrides': {
			const on = Object.entries(value as Record<string, boolean>).filter(([, v]) => v);
			return on.length === 0 ? 'none' : on.map(([k]) => k).join(', ');
		}
		case 'location': {
			const l = value as { sheet: number; x: number; y: number };
			return `sheet ${l.sheet}, ${Math.round(l.x * 100)} % across, ${Math.round(l.y * 100)} % down`;
		}
		default:
			return String(value);
	}
}

/** Each field the person changed: its name, their value and the value saved now. */
export function conflictRows(current: FeatureJson, mine: Partial<NewFeature>) {
	return (Object.keys(mine) as (keyof NewFeature)[]).map((key) => ({
		key,
		name: names[key] ?? key,
		yours: shown(key, mine[key]),
		saved: shown(key, current[key as keyof FeatureJson])
	}));
}

/** The feature as it stands now with the person's changed fields put back (not yet saved). */
export function reapplied(current: FeatureJson, mine: Partial<NewFeature>): FeatureDraft {
	const draft = draftOf(current);
	for (const key of Object.keys(mine) as (keyof NewFeature)[]) {
		const value = mine[key];
		switch (key) {
			case 'datumFeature':
				draft.datumFeature = (value as string | null) ?? '';
				break;
			case 'quantity':
				draft.quantity = value === undefined ? '' : String(value);
				break;
			case 'internal':
				draft.internal = (value as boolean | undefined) ?? null;
				break;
			case 'controls':
			case 'overrides':
			case 'location':
				(draft as unknown as Record<string, unknown>)[key] = structuredClone(value);
				break;
			default:
				(draft as unknown as Record<string, unknown>)[key] = value;
		}
	}
	return draft;
}

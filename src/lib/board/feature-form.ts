/*
 * The feature form's data on the board: a draft of a feature's stored fields, read from a saved
 * feature, checked as it is typed (with the core, in the browser) and turned into the API's
 * POST body or the PATCH of what changed. Pure: tested in tests/unit/feature-form.test.ts.
 */
import { internalKinds, type FeatureJson, type FeatureKind, type NewFeature } from '$lib/features';
import { evaluateFeature, type GeometricControl } from '$lib/tolerance/feature';
import type { DrawingContext } from '$lib/tolerance/drawing-context';

export type Settings = FeatureJson['settings'];
export type Location = NonNullable<FeatureJson['location']>;

export interface FeatureDraft {
	label: string;
	kind: FeatureKind;
	/** null: not chosen by the person, so guessed (the ISO 286 code's letter case, else the kind). */
	internal: boolean | null;
	boughtOut: boolean;
	datumFeature: string;
	callout: string;
	/** '' : the callout's `4X`, else 1. */
	quantity: string;
	controls: GeometricControl[];
	overrides: { envelope: boolean; independency: boolean; stock: boolean; freeState: boolean };
	location: Location | null;
	notes: string;
}

export function emptyDraft(location: Location | null): FeatureDraft {
	return {
		label: '',
		kind: 'hole',
		internal: null,
		boughtOut: false,
		datumFeature: '',
		callout: '',
		quantity: '',
		controls: [],
		overrides: { envelope: false, independency: false, stock: false, freeState: false },
		location,
		notes: ''
	};
}

/** A saved feature as a draft; `internal` counts as chosen only where it differs from the guess. */
export function draftOf(f: FeatureJson): FeatureDraft {
	return {
		label: f.label,
		kind: f.kind,
		internal: f.internal === guessInternal(f.callout, f.kind, f.settings) ? null : f.internal,
		boughtOut: f.boughtOut,
		datumFeature: f.datumFeature ?? '',
		callout: f.callout,
		quantity: String(f.quantity),
		controls: structuredClone(f.controls),
		overrides: { ...f.overrides },
		location: f.location,
		notes: f.notes
	};
}

/** Internal or external when the person has not said: the code's letter case, else the kind. */
export function guessInternal(callout: string, kind: FeatureKind, settings: Settings) {
	if (callout.trim()) {
		const read = evaluateFeature({ callout, units: settings.units, standard: settings.standard });
		if (read.ok) return read.internal;
	}
	return internalKinds.includes(kind);
}

export const internalOf = (d: FeatureDraft, settings: Settings) =>
	d.internal ?? guessInternal(d.callout, d.kind, settings);

/**
 * What the core says of the draft as it stands: null when it reads (or is a plain datum face),
 * else the message and, for the callout, the character at fault.
 */
export function draftProblem(d: FeatureDraft, settings: Settings, drawingNotes = '') {
	if (!d.callout.trim()) {
		return d.datumFeature.trim()
			? null
			: {
					field: 'callout',
					message: 'Write the callout, or mark a plain face as a datum feature',
					position: null
				};
	}
	const context: Pick<DrawingContext, 'units' | 'standard' | 'generalTolerance'> = settings;
	const result = evaluateFeature({
		callout: d.callout,
		internal: internalOf(d, settings),
		...context,
		controls: d.controls,
		overrides: d.overrides,
		notes: [drawingNotes, d.notes].filter(Boolean).join('\n') || undefined
	});
	return result.ok
		? null
		: { field: result.field, message: result.message, position: result.position };
}

/** The POST body of a new feature; `internal` and `quantity` left out when not given. */
export function inputOf(d: FeatureDraft): NewFeature {
	const quantity = Number(d.quantity);
	return {
		label: d.label.trim(),
		kind: d.kind,
		...(d.internal === null ? {} : { internal: d.internal }),
		boughtOut: d.boughtOut,
		datumFeature: d.datumFeature.trim() || null,
		callout: d.callout.trim(),
		...(d.quantity.trim() && Number.isInteger(quantity) ? { quantity } : {}),
		controls: d.controls,
		overrides: d.overrides,
		location: d.location,
		notes: d.notes
	};
}

/** The fields of `d` that differ from the saved feature (without `version`). */
export function changesOf(saved: FeatureJson, d: FeatureDraft): Partial<NewFeature> {
	const next = inputOf(d);
	const before = inputOf(draftOf(saved));
	const changes: Record<string, unknown> = {};
	for (const key of Object.keys(next) as (keyof NewFeature)[]) {
		if (JSON.stringify(next[key]) !== JSON.stringify(before[key])) changes[key] = next[key];
	}
	// What the form shows is what is stored: a new guess (another code or kind) is sent as chosen.
	const internal = internalOf(d, saved.settings);
	if (internal !== saved.internal) changes.internal = internal;
	// A new callout's `4X` counts again unless the person typed another quantity.
	if ('callout' in changes && d.quantity === String(saved.quantity)) delete changes.quantity;
	return changes as Partial<NewFeature>;
}

/** The marker a feature shows on the board. */
export function featureMarker(f: FeatureJson & { location: Location }, movable: boolean) {
	const name = f.label || (f.datumFeature && !f.callout ? `Datum ${f.datumFeature}` : '');
	return {
		id: `feature-${f.id}`,
		location: f.location,
		label: String(f.balloon),
		title: [name, f.callout].filter(Boolean).join(': '),
		tone: 'feature' as const,
		movable
	};
}

export const featureIdOf = (markerId: string) =>
	markerId.startsWith('feature-') ? markerId.slice('feature-'.length) : null;

/** The quantity a callout writes (`4X`), or null when it reads none. */
export function writtenQuantity(callout: string, settings: Settings): number | null {
	if (!callout.trim()) return null;
	const read = evaluateFeature({
		callout,
		internal: true,
		units: settings.units,
		standard: settings.standard
	});
	return read.ok ? (read.spec.quantity ?? null) : null;
}

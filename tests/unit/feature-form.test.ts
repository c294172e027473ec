import { describe, expect, it } from 'vitest';
import {
	changesOf,
	draftOf,
	draftProblem,
	emptyDraft,
	featureIdOf,
	featureMarker,
	guessInternal,
	inputOf,
	writtenQuantity
} from '../../src/lib/board/feature-form';
import { conflictRows, reapplied } from '../../src/lib/board/conflict';
import type { FeatureJson } from '../../src/lib/features';

const iso = { units: 'mm', standard: 'iso-8015', generalTolerance: null } as const;

/** A saved feature as the API answers it (only the stored fields matter here). */
function saved(fields: Partial<FeatureJson> = {}): FeatureJson {
	return {
		id: '00000000-0000-4000-8000-000000000001',
		balloon: 7,
		label: 'Bore',
		kind: 'bore',
		internal: true,
		boughtOut: false,
		datumFeature: null,
		carried: null,
		callout: 'Ø12 H7',
		quantity: 1,
		controls: [],
		overrides: { envelope: false, independency: false, stock: false, freeState: false },
		location: { sheet: 1, x: 0.5, y: 0.5 },
		notes: '',
		version: 3,
		createdAt: '',
		updatedAt: '',
		settings: iso,
		problem: null,
		findings: [],
		...fields
	};
}

describe('the feature form on the board', () => {
	it("guesses internal from an ISO 286 code's letter case, else from the kind", () => {
		// ISO 286-1: capital letters for holes, small letters for shafts (recalled).
		expect(guessInternal('Ø12 H7', 'pin', iso)).toBe(true);
		expect(guessInternal('Ø12 g6', 'hole', iso)).toBe(false);
		expect(guessInternal('Ø12 ±0.1', 'slot', iso)).toBe(true);
		expect(guessInternal('Ø12 ±0.1', 'pin', iso)).toBe(false);
	});

	it('points at the character where the callout stops reading', () => {
		const draft = { ...emptyDraft(null), callout: 'Ø12 ±0.1x' };
		const problem = draftProblem(draft, iso);
		expect(problem?.field).toBe('callout');
		expect(problem?.position).toBe(8); // the stray "x"
		expect(draftProblem({ ...draft, callout: 'Ø12 H7' }, iso)).toBeNull();
	});

	it('takes a plain face with a datum letter and no callout', () => {
		const face = { ...emptyDraft({ sheet: 1, x: 0.1, y: 0.2 }), kind: 'other' as const };
		expect(draftProblem(face, iso)?.field).toBe('callout');
		expect(draftProblem({ ...face, datumFeature: 'A' }, iso)).toBeNull();
		expect(inputOf({ ...face, datumFeature: ' a ' })).toMatchObject({
			callout: '',
			datumFeature: 'a',
			location: { sheet: 1, x: 0.1, y: 0.2 }
		});
	});

	it("leaves out internal and quantity that were not given, so the server reads the callout's", () => {
		const input = inputOf({ ...emptyDraft(null), callout: '4X Ø6.6 ±0.1' });
		expect(input).not.toHaveProperty('internal');
		expect(input).not.toHaveProperty('quantity');
		expect(writtenQuantity('4X Ø6.6 ±0.1', iso)).toBe(4);
		expect(inputOf({ ...emptyDraft(null), quantity: '3' }).quantity).toBe(3);
	});

	it('sends only what changed', () => {
		const feature = saved();
		const draft = draftOf(feature);
		expect(changesOf(feature, draft)).toEqual({});
		draft.label = 'Bushing bore';
		draft.controls.push({
			characteristic: 'position',
			value: '0.02',
			diameterZone: true,
			appliesTo: 'median',
			modifier: 'mmc',
			datums: ['A']
		});
		expect(Object.keys(changesOf(feature, draft)).sort()).toEqual(['controls', 'label']);
		expect(feature.controls).toEqual([]); // the saved feature is untouched
	});

	it('sends internal when the form shows another value than the stored one', () => {
		const feature = saved({ callout: 'Ø12 ±0.1', kind: 'bore', internal: true });
		const draft = draftOf(feature);
		expect(draft.internal).toBeNull(); // stored as guessed
		draft.kind = 'pin';
		expect(changesOf(feature, draft)).toEqual({ kind: 'pin', internal: false });
		// A choice against the guess is kept as chosen.
		const chosen = draftOf(saved({ callout: 'Ø12 ±0.1', kind: 'pin', internal: true }));
		expect(chosen.internal).toBe(true);
	});

	it('names markers after their features', () => {
		const feature = saved() as FeatureJson & { location: { sheet: number; x: number; y: number } };
		const marker = featureMarker(feature, true);
		expect(marker).toMatchObject({ label: '7', title: 'Bore: Ø12 H7', movable: true });
		expect(featureIdOf(marker.id)).toBe(feature.id);
		expect(featureIdOf('finding-3')).toBeNull();
	});
});

describe('a feature edit overtaken by someone else', () => {
	it('puts the typed fields back on top of the feature as it stands now', () => {
		const theirs = saved({ label: 'Bearing bore', callout: 'Ø18 H8' });
		const mine = { notes: 'Hone to size.', datumFeature: 'B', quantity: 2 };
		const draft = reapplied(theirs, mine);
		expect(draft.label).toBe('Bearing bore');
		expect(draft.callout).toBe('Ø18 H8');
		expect(draft.notes).toBe('Hone to size.');
		expect(draft.datumFeature).toBe('B');
		expect(draft.quantity).toBe('2');
		// Saving it sends exactly the person's changes, against the newer version.
		expect(changesOf(theirs, draft)).toEqual(mine);
	});

	it('takes back a changed callout and tolerances, and leaves the rest as they now are', () => {
		const theirs = saved({ label: 'Renamed by someone', callout: 'Ø18 H8' });
		const controls = [
			{
				characteristic: 'position',
				value: '0.02',
				diameterZone: true,
				appliesTo: 'median',
				modifier: 'mmc',
				datums: ['A']
			}
		] as FeatureJson['controls'];
		const draft = reapplied(theirs, { callout: 'Ø18 H6', controls });
		expect(draft).toEqual({ ...draftOf(theirs), callout: 'Ø18 H6', controls });
		expect(draft.controls).not.toBe(controls);
	});

	it('lists each typed field beside the saved value', () => {
		const rows = conflictRows(saved({ callout: 'Ø18 H8' }), {
			callout: 'Ø18 H6',
			notes: 'Hone.',
			boughtOut: true
		});
		expect(rows).toEqual([
			{ key: 'callout', name: 'Callout', yours: 'Ø18 H6', saved: 'Ø18 H8' },
			{ key: 'notes', name: 'Notes', yours: 'Hone.', saved: '—' },
			{ key: 'boughtOut', name: 'Bought-out part', yours: 'yes', saved: 'no' }
		]);
	});
});

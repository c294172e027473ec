import { describe, expect, it } from 'vitest';
import { conflictRows, reapplied } from '../../src/lib/board/conflict';
import { changesOf, draftOf } from '../../src/lib/board/feature-form';
import type { FeatureJson } from '../../src/lib/features';

/** The parts of a saved feature the form reads. */
const saved = (over: Partial<FeatureJson> = {}) =>
	({
		id: 'f1',
		balloon: 3,
		label: 'Bearing bore',
		kind: 'bore',
		internal: true,
		boughtOut: false,
		datumFeature: null,
		callout: 'Ø18 H8',
		quantity: 1,
		controls: [],
		overrides: { envelope: false, independency: false, stock: false, freeState: false },
		location: { sheet: 1, x: 0.3, y: 0.4 },
		notes: '',
		version: 3,
		settings: { units: 'mm', standard: 'iso-8015', generalTolerance: null },
		...over
	}) as unknown as FeatureJson;

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
		const theirs = saved({ label: 'Renamed by someone' });
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
		const rows = conflictRows(saved(), { callout: 'Ø18 H6', notes: 'Hone.', boughtOut: true });
		expect(rows).toEqual([
			{ key: 'callout', name: 'Callout', yours: 'Ø18 H6', saved: 'Ø18 H8' },
			{ key: 'notes', name: 'Notes', yours: 'Hone.', saved: '—' },
			{ key: 'boughtOut', name: 'Bought-out part', yours: 'yes', saved: 'no' }
		]);
	});
});

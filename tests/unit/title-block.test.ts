import { describe, expect, test } from 'vitest';
import { PER_INCH, PER_MM } from '../../src/lib/tolerance/decimal';
import {
	titleBlockAngle,
	titleBlockTolerance,
	type DecimalPlacesTolerance
} from '../../src/lib/tolerance/title-block';

// An inch title block of the usual form (PRODUCT.md §6 generalTolerance shape).
const block: DecimalPlacesTolerance = {
	kind: 'decimal-places',
	byPlaces: { '1': '0.1', '2': '0.01', '3': '0.005' },
	angle: '0.5'
};

describe('title-block tolerances by decimal places', () => {
	test('each stated place count', () => {
		expect(titleBlockTolerance(1, block)).toMatchObject({ ok: true, deviation: PER_INCH / 10 });
		expect(titleBlockTolerance(2, block)).toMatchObject({ ok: true, deviation: PER_INCH / 100 });
		expect(titleBlockTolerance(3, block)).toMatchObject({
			ok: true,
			deviation: (PER_INCH / 1000) * 5,
			published: '0.005'
		});
	});

	test('places the block does not state are not covered', () => {
		const r = titleBlockTolerance(4, block);
		expect(r.ok).toBe(false);
		expect(!r.ok && r.reason).toContain('4 decimal places');
		expect(titleBlockTolerance(0, block).ok).toBe(false);
		expect(titleBlockTolerance(-1, block).ok).toBe(false);
		expect(titleBlockTolerance(2, null).ok).toBe(false);
	});

	test('per drawing, in its own units, with or without ±', () => {
		const metric: DecimalPlacesTolerance = {
			kind: 'decimal-places',
			byPlaces: { '0': '±0.5', '1': '0.2', '2': '0.05' }
		};
		expect(titleBlockTolerance(0, metric, 'mm')).toMatchObject({ deviation: PER_MM / 2 });
		expect(titleBlockTolerance(2, metric, 'mm')).toMatchObject({ deviation: PER_MM / 20 });
		const custom: DecimalPlacesTolerance = {
			kind: 'decimal-places',
			byPlaces: { '3': '.002', '4': '.0005' }
		};
		expect(titleBlockTolerance(4, custom)).toMatchObject({ deviation: PER_INCH / 2000 });
		const broken: DecimalPlacesTolerance = { kind: 'decimal-places', byPlaces: { '2': 'ten' } };
		expect(titleBlockTolerance(2, broken).ok).toBe(false);
	});

	test('angle', () => {
		expect(titleBlockAngle(block)).toMatchObject({ ok: true, degrees: '0.5', arcSeconds: 1800 });
		expect(
			titleBlockAngle({ kind: 'decimal-places', byPlaces: {}, angle: '±0.25°' })
		).toMatchObject({ degrees: '0.25', arcSeconds: 900 });
		expect(titleBlockAngle({ kind: 'decimal-places', byPlaces: {} }).ok).toBe(false);
	});
});

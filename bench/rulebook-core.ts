// Rulebook throughput: 100,000 features and 50,000 fits judged in full, then one edit judged
// incrementally, against JSON.parse of the same data as a yardstick. Run: npx tsx bench/rulebook-core.ts
import { evaluateFeature } from '../src/lib/tolerance/feature';
import { evaluate, indexRulebook } from '../src/lib/tolerance/rulebook';
import type {
	RulebookDrawing,
	RulebookFeature,
	RulebookFit,
	RulebookInput
} from '../src/lib/tolerance/rulebook';

const FEATURES = 100_000;
const FITS = 50_000;
const ROUNDS = 3;

let seed = 0x51ab3c7;
function random(n: number): number {
	seed = (seed * 1_103_515_245 + 12_345) & 0x7fffffff;
	return seed % n;
}

function pick<T>(items: readonly T[]): T {
	return items[random(items.length)];
}

const holeClasses = ['H7', 'H8', 'G7', 'K7', 'N7', 'P7', 'H11'];
const shaftClasses = ['g6', 'h6', 'f7', 'k6', 'js6', 'p6', 's6', 'h11'];

function size(): string {
	return String(2 + random(200));
}

/** A mixed drawing: half fit pairs (hole, shaft), the rest general sizes, limits and threads. */
function feature(i: number): RulebookFeature {
	const id = `f${i}`;
	if (i < FITS * 2) {
		const hole = i % 2 === 0;
		const nominal = hole ? size() : '';
		return {
			id,
			kind: hole ? 'hole' : 'shaft',
			internal: hole,
			callout: hole ? `Ø${nominal} ${pick(holeClasses)}${random(10) ? ' Ⓔ' : ''}` : '',
			controls: random(3)
				? []
				: [
						{
							characteristic: hole ? 'position' : 'straightness',
							value: pick(['0.01', '0.02', '0.05']),
							diameterZone: true,
							appliesTo: 'median',
							modifier: pick(['mmc', 'rfs'] as const),
							datums: hole ? ['A', 'B'] : []
						}
					]
		};
	}
	switch (random(5)) {
		case 0:
			return { id, kind: 'width', internal: false, callout: `${size()}` };
		case 1:
			return {
				id,
				kind: 'slot',
				internal: true,
				callout: `${size()}.0${random(9)} ±0.0${1 + random(8)}`
			};
		case 2:
			return {
				id,
				kind: 'tab',
				internal: false,
				callout: `${size()}.000-${size()}.050`,
				controls: [
					{
						characteristic: 'flatness',
						value: '0.02',
						diameterZone: false,
						appliesTo: 'surface',
						modifier: 'rfs',
						datums: []
					}
				]
			};
		case 3:
			return { id, kind: 'thread', internal: true, callout: `M${pick(['4', '6', '8'])}x1-6H` };
		default:
			return { id, kind: 'hole', internal: true, callout: `Ø${size()} H${pick(['7', '8', '9'])}` };
	}
}

const drawing: RulebookDrawing = {
	units: 'mm',
	standard: 'iso-8015',
	generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' },
	notes: 'ISO 8015',
	datums: ['A', 'B']
};
const features: RulebookFeature[] = [];
for (let i = 0; i < FEATURES; i++) features.push(feature(i));
// The shaft of each pair takes the hole's nominal size, so fits are realistic.
for (let i = 0; i < FITS * 2; i += 2) {
	const nominal = /Ø(\d+)/.exec(features[i].callout)![1];
	features[i + 1].callout = `Ø${nominal} ${pick(shaftClasses)}${random(10) ? ' Ⓔ' : ''}`;
}
const fits: RulebookFit[] = [];
for (let i = 0; i < FITS; i++)
	fits.push({
		id: `fit${i}`,
		holeFeatureId: `f${2 * i}`,
		shaftFeatureId: `f${2 * i + 1}`,
		intent: pick(['running', 'locational-clearance', 'transition', 'interference'] as const)
	});

const json = JSON.stringify({ drawing, features, fits });

function time(run: () => void): number {
	let best = Infinity;
	for (let r = 0; r < ROUNDS; r++) {
		const start = performance.now();
		run();
		best = Math.min(best, performance.now() - start);
	}
	return best;
}

const input: RulebookInput = { drawing, features, fits };

// One edit as the app makes it: the revision's index is kept, the edited feature is replaced in
// place, and only that feature is named. Measured first, before the full runs fill the heap.
const index = indexRulebook(features, fits);
const edited = 2 * 123;
const original = features[edited];
const incremental =
	time(() => {
		for (let k = 0; k < 100; k++) {
			features[edited] = { ...original, callout: k % 2 ? 'Ø50 H8' : original.callout };
			evaluate({ ...input, index, only: { featureIds: [original.id] } });
		}
	}) / 100;
features[edited] = original;

let results = 0;
const featuresOnly = time(() => {
	results = evaluate({ drawing, features, fits: [] }).length;
});
const fullRun = time(() => {
	results = evaluate(input).length;
});
// What the core's own feature evaluation costs, for the same features, so the rules' share shows.
const core = time(() => {
	for (const f of features)
		evaluateFeature({
			callout: f.callout,
			internal: f.internal,
			units: drawing.units,
			standard: drawing.standard,
			generalTolerance: drawing.generalTolerance,
			controls: f.controls,
			notes: drawing.notes
		});
});
const parse = time(() => {
	JSON.parse(json);
});

const us = (ms: number, n: number) => ((ms * 1000) / n).toFixed(2);
console.log(
	`rulebook: ${FEATURES} features, ${FITS} fits (${(json.length / 1e6).toFixed(1)} MB as JSON), best of ${ROUNDS}`
);
console.log(
	`  features alone      ${featuresOnly.toFixed(0)} ms  ${us(featuresOnly, FEATURES)} µs/feature`
);
console.log(
	`  of which evaluateFeature ${core.toFixed(0)} ms  ${us(core, FEATURES)} µs/feature (feature.ts, before any rule)`
);
console.log(`  full run            ${fullRun.toFixed(0)} ms  ${results} results`);
console.log(
	`  fits (full − alone) ${(fullRun - featuresOnly).toFixed(0)} ms  ${us(fullRun - featuresOnly, FITS)} µs/fit`
);
console.log(
	`  incremental edit    ${(incremental * 1000).toFixed(0)} µs  (one feature, its fit and that fit's members)`
);
console.log(
	`  JSON.parse yardstick ${parse.toFixed(0)} ms  ${us(parse, FEATURES)} µs/feature of the same data`
);

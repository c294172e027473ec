/*
 * The demo scenario of PRODUCT.md §8 (Kestrel Fluidics' dosing pump) as plain rulebook input:
 * the features the seed places on the demo sheets, and the rulebook tests' fixture.
 * The parts, people and numbers are invented for Checkplate. Deliberate mistakes are marked
 * "deliberate"; everything else is meant to be right.
 */
import type { RulebookDrawing, RulebookFeature, RulebookFit } from '../../tolerance/rulebook';
import type { GeometricControl } from '../../tolerance/feature';

export interface DemoReview {
	number: string;
	title: string;
	drawing: RulebookDrawing;
	features: RulebookFeature[];
	fits: RulebookFit[];
}

const isoGeneral = { kind: 'iso2768', linear: 'm', geometric: 'K' } as const;

/** Circular run-out 0.02 to datum A: how the shaft and the bushing hold a diameter true. */
const runOutToA = {
	characteristic: 'circular-runout',
	value: '0.02',
	diameterZone: false,
	appliesTo: 'surface',
	modifier: 'rfs',
	datums: ['A']
} satisfies GeometricControl;

export const housing: DemoReview = {
	number: 'KF-1001',
	title: 'Pump housing',
	drawing: {
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		notes:
			'ISO 8015\nISO 2768-mK\nBREAK SHARP EDGES 0.2 TO 0.4 × 45°\nANODISE CLEAR AFTER MACHINING',
		// Datum A is the front (mounting) face; B is the bushing bore, whose axis centres the
		// basic 64 × 44 bolt pattern.
		datums: ['A', 'B']
	},
	features: [
		// Deliberate: the bore the bushing is pressed into has no Ⓔ.
		{
			id: 'kf1001-bore',
			balloon: 1,
			label: 'Bushing bore',
			kind: 'bore',
			internal: true,
			callout: 'Ø18 H7',
			datumFeature: 'B'
		},
		{
			id: 'kf1001-dowel',
			balloon: 2,
			label: 'Dowel holes',
			kind: 'hole',
			internal: true,
			callout: '2X Ø6 H7 Ⓔ',
			quantity: 2,
			// The dowels locate the cover: the holes are positioned to the face and the bore.
			controls: [
				{
					characteristic: 'position',
					value: '0.05',
					diameterZone: true,
					appliesTo: 'median',
					modifier: 'rfs',
					datums: ['A', 'B']
				}
			]
		},
		{
			id: 'kf1001-bolt',
			balloon: 3,
			label: 'Cover bolt holes',
			kind: 'hole',
			internal: true,
			callout: '4X Ø6.6',
			quantity: 4,
			controls: [
				{
					characteristic: 'position',
					value: '0.2',
					diameterZone: true,
					appliesTo: 'median',
					modifier: 'mmc',
					datums: ['A', 'B']
				}
			]
		},
		// Deliberate: the slot's width is given only as a reference dimension (8). A reference
		// dimension carries no tolerance and the general tolerance does not apply to it, so the
		// slot has no limits at all.
		{
			id: 'kf1001-slot',
			balloon: 4,
			label: 'Slot width',
			kind: 'slot',
			internal: true,
			callout: '(8)'
		}
	],
	fits: []
};

export const shaft: DemoReview = {
	number: 'KF-1002',
	title: 'Drive shaft',
	drawing: {
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		notes:
			'ISO 8015\nISO 2768-mK\nCHAMFER ENDS AND SHOULDERS 0.5 × 45°\nKEYWAY FOR PARALLEL KEY 3 × 3'
	},
	features: [
		{
			id: 'kf1002-journal',
			balloon: 1,
			label: 'Journal',
			kind: 'shaft',
			internal: false,
			callout: 'Ø12 g6',
			// The journal runs in the bushing: its axis is the shaft's datum A.
			datumFeature: 'A',
			// Deliberate: Ø0.02 at MMC is larger than the g6 tolerance (0.011), and the VC 12.014
			// does not go into the bushing's Ø12 H7.
			controls: [
				{
					characteristic: 'straightness',
					value: '0.02',
					diameterZone: true,
					appliesTo: 'median',
					modifier: 'mmc',
					datums: []
				}
			]
		},
		{
			id: 'kf1002-coupling',
			balloon: 2,
			label: 'Coupling end',
			kind: 'shaft',
			internal: false,
			callout: 'Ø10 h6 Ⓔ',
			// The coupling end runs true to the journal.
			controls: [runOutToA]
		},
		{
			id: 'kf1002-keyway',
			balloon: 3,
			label: 'Keyway width',
			kind: 'slot',
			internal: true,
			callout: '3 N9'
		}
	],
	fits: []
};

export const bushing: DemoReview = {
	number: 'KF-1003',
	title: 'Bushing',
	drawing: {
		units: 'mm',
		standard: 'iso-8015',
		generalTolerance: isoGeneral,
		notes: 'ISO 8015\nISO 2768-mK\nCHAMFER 0.5 × 45° ALL EDGES'
	},
	features: [
		// Deliberate: the journal runs in this bore and it has no Ⓔ. The bore is the bushing's
		// datum A.
		{
			id: 'kf1003-bore',
			balloon: 1,
			label: 'Bore',
			kind: 'bore',
			internal: true,
			callout: 'Ø12 H7',
			datumFeature: 'A'
		},
		// Pressed into the housing; it runs true to the bore.
		{
			id: 'kf1003-outside',
			balloon: 2,
			label: 'Outside diameter',
			kind: 'shaft',
			internal: false,
			callout: 'Ø18 p6 Ⓔ',
			controls: [runOutToA]
		},
		{
			id: 'kf1003-length',
			balloon: 3,
			label: 'Length',
			kind: 'width',
			internal: false,
			callout: '20'
		}
	],
	fits: []
};

export const bracket: DemoReview = {
	number: 'KF-2001',
	title: 'Mounting bracket',
	drawing: {
		units: 'in',
		standard: 'asme-y14.5-2018',
		generalTolerance: {
			kind: 'decimal-places',
			byPlaces: { '2': '0.01', '3': '0.005' },
			angle: '0.5'
		},
		notes:
			'DIMENSIONING AND TOLERANCING PER ASME Y14.5-2018\nPIVOT FIT: RUNNING\nPIVOT PIN IS A BOUGHT-OUT PART, SHOWN FOR THE FIT\nBREAK SHARP EDGES',
		// Datum A is the tab's outer face, to which the pivot hole is square.
		datums: ['A']
	},
	features: [
		// Deliberate: 3 places and 4 places in one limit pair.
		{
			id: 'kf2001-pivot-hole',
			balloon: 1,
			label: 'Pivot hole',
			kind: 'hole',
			internal: true,
			callout: 'Ø.250-.2515',
			controls: [
				{
					characteristic: 'perpendicularity',
					value: '.002',
					diameterZone: true,
					appliesTo: 'median',
					modifier: 'rfs',
					datums: ['A']
				}
			]
		},
		// Deliberate: 4 places and 3 places; and MMC .2500 equals the hole's MMC. Bought out
		// (the notes say so), so it is not asked for a location control of its own.
		{
			id: 'kf2001-pivot-pin',
			balloon: 2,
			label: 'Pivot pin',
			kind: 'pin',
			internal: false,
			callout: 'Ø.2500-.249',
			boughtOut: true
		},
		{
			id: 'kf2001-tab',
			balloon: 3,
			label: 'Tab thickness',
			kind: 'tab',
			internal: false,
			callout: '.250 ±.005',
			// Deliberate: .015 is larger than the size tolerance .010; Rule #1 already holds .010.
			controls: [
				{
					characteristic: 'flatness',
					value: '.015',
					diameterZone: false,
					appliesTo: 'surface',
					modifier: 'rfs',
					datums: []
				}
			]
		},
		{
			id: 'kf2001-base',
			balloon: 4,
			label: 'Base thickness',
			kind: 'width',
			internal: false,
			callout: '.25'
		}
	],
	fits: [
		// Deliberate: a running fit with no allowance at MMC.
		{
			id: 'fit-pivot',
			holeFeatureId: 'kf2001-pivot-hole',
			shaftFeatureId: 'kf2001-pivot-pin',
			intent: 'running'
		}
	]
};

/** A drawing's features as members seen from another drawing: each carries its own drawing. */
function onOwnDrawing(d: DemoReview): RulebookFeature[] {
	return d.features.map((f) => ({ ...f, drawing: d.drawing }));
}

/**
 * The pump as one assembly: the features of the three metric drawings with the fits that tie
 * them together. The run is the housing's; the shaft's and the bushing's features carry their
 * own drawings, so each member is read and judged under its own units, standard and general
 * tolerance, and each fit is computed in its hole's unit.
 */
export const pumpAssembly: DemoReview = {
	number: 'KF-1000',
	title: 'Pump head assembly (fits across KF-1001, KF-1002, KF-1003)',
	drawing: housing.drawing,
	features: [...housing.features, ...onOwnDrawing(shaft), ...onOwnDrawing(bushing)],
	fits: [
		{
			id: 'fit-journal',
			holeFeatureId: 'kf1003-bore',
			shaftFeatureId: 'kf1002-journal',
			intent: 'running'
		},
		// Deliberate: Ø18 H7/p6 holds at 20 °C (max clearance 0), but the pump runs at 80 °C and
		// the aluminium housing grows faster than the bronze bushing, so the press fit is lost.
		{
			id: 'fit-bushing',
			holeFeatureId: 'kf1001-bore',
			shaftFeatureId: 'kf1003-outside',
			intent: 'interference',
			temperature: {
				operating: '80',
				// EN AW-6082 (KF-1001's material): 23.4 × 10⁻⁶/K, 20–100 °C, common handbook value
				// (recalled).
				holeCoefficient: '23.4',
				// CuSn8 (KF-1003's material): 18.5 × 10⁻⁶/K, common handbook value (recalled).
				shaftCoefficient: '18.5'
			}
		},
		// The dowels sit in their H7 holes as a locational transition fit (H7/m6); the holes
		// that hold them are not clearance holes, so no fastener budget applies.
		{
			id: 'fit-dowel',
			holeFeatureId: 'kf1001-dowel',
			fastener: { callout: 'Ø6 m6', label: 'dowel pin' },
			intent: 'transition'
		},
		{
			id: 'fit-cover-bolt',
			holeFeatureId: 'kf1001-bolt',
			fastener: { callout: 'M6', label: 'cover bolt' },
			intent: 'floating-fastener'
		}
	]
};

export const demoReviews: DemoReview[] = [housing, shaft, bushing, bracket];

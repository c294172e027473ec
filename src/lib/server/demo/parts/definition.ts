import type { Units } from '$lib/tolerance/decimal';
import type { GeneralTolerance, GoverningStandard } from '$lib/tolerance/drawing-context';
import type { DemoCallout, Sheet } from '../sheet';

export type { GeneralTolerance } from '$lib/tolerance/drawing-context';

export type DemoDrawingNumber = 'KF-1001' | 'KF-1002' | 'KF-1003' | 'KF-2001';

export interface DemoDrawing {
	number: DemoDrawingNumber;
	title: string;
	partName: string;
	material: string;
	units: Units;
	standard: GoverningStandard;
	generalTolerance: GeneralTolerance;
	notes: string;
	/** Page size in PDF points (one sheet each). */
	sheets: { width: number; height: number }[];
	/** Every callout drawn, with where it sits (see DemoCallout). */
	callouts: DemoCallout[];
}

/** One part drawing of the demo: what goes in its title block and notes, and how to draw it. */
export interface PartDrawing extends Omit<DemoDrawing, 'callouts' | 'notes' | 'sheets'> {
	size: 'A3' | 'A4';
	scale: string;
	projection: 'first' | 'third';
	tolerancing: string[];
	noteLines: string[];
	drawnBy: string;
	draw: (s: Sheet) => void;
}

/** What the metric drawings share: ISO 8015, ISO 2768-mK, millimetres, first-angle projection. */
export const isoMetric = {
	units: 'mm',
	standard: 'iso-8015',
	generalTolerance: { kind: 'iso2768', linear: 'm', geometric: 'K' },
	projection: 'first',
	tolerancing: ['TOLERANCING ISO 8015', 'GENERAL TOLERANCES ISO 2768-mK', 'DIMENSIONS IN mm']
} satisfies Partial<PartDrawing>;

/*
 * ISO 2768 general tolerances, as published (mm as decimal strings, angles in minutes of arc).
 *
 * Sources:
 *  - LINEAR, BROKEN_EDGES, ANGULAR: ISO 2768-1:1989, tables 1, 2 and 3. Values recalled from
 *    memory; they match the widely reprinted tables (e.g. Machinery's Handbook, general
 *    tolerance notes on ISO drawings).
 *  - STRAIGHTNESS_FLATNESS, PERPENDICULARITY, SYMMETRY, CIRCULAR_RUNOUT: ISO 2768-2:1989,
 *    tables 1 to 4. Values recalled from memory. ISO 2768-2 was withdrawn in 2021 and replaced
 *    by ISO 22081; drawings still cite it, so it is still read.
 * A range [upTo, …] reads "over the previous bound up to and including upTo"; the first range of
 * each table starts where `from` says. null marks a gap the standard leaves (not covered).
 */

export const LINEAR_CLASSES = ['f', 'm', 'c', 'v'] as const;
export const GEOMETRIC_CLASSES = ['H', 'K', 'L'] as const;
export type LinearClass = (typeof LINEAR_CLASSES)[number];
export type GeometricClass = (typeof GEOMETRIC_CLASSES)[number];

export interface Table<C extends string> {
	/** Smallest size covered (inclusive), mm. */
	from: string;
	/** Upper bounds in mm; null = no upper bound. */
	upTo: readonly (string | null)[];
	values: Readonly<Record<C, readonly (string | null)[]>>;
}

/** ISO 2768-1:1989, table 1: permissible deviations (±) for linear dimensions except broken edges. */
export const LINEAR: Table<LinearClass> = {
	from: '0.5',
	upTo: ['3', '6', '30', '120', '400', '1000', '2000', '4000'],
	values: {
		f: ['0.05', '0.05', '0.1', '0.15', '0.2', '0.3', '0.5', null],
		m: ['0.1', '0.1', '0.2', '0.3', '0.5', '0.8', '1.2', '2'],
		c: ['0.2', '0.3', '0.5', '0.8', '1.2', '2', '3', '4'],
		v: [null, '0.5', '1', '1.5', '2.5', '4', '6', '8']
	}
};

/** ISO 2768-1:1989, table 2: permissible deviations (±) for broken edges (external radii, chamfer heights). */
export const BROKEN_EDGES: Table<LinearClass> = {
	from: '0.5',
	upTo: ['3', '6', null],
	values: {
		f: ['0.2', '0.5', '1'],
		m: ['0.2', '0.5', '1'],
		c: ['0.4', '1', '2'],
		v: ['0.4', '1', '2']
	}
};

/** ISO 2768-1:1989, table 3: permissible deviations (±) of angles, in minutes of arc, by the shorter leg. */
export const ANGULAR: {
	upTo: readonly (string | null)[];
	values: Record<LinearClass, readonly number[]>;
} = {
	upTo: ['10', '50', '120', '400', null],
	values: {
		f: [60, 30, 20, 10, 5],
		m: [60, 30, 20, 10, 5],
		c: [90, 60, 30, 15, 10],
		v: [180, 120, 60, 30, 20]
	}
};

/** ISO 2768-2:1989, table 1: general tolerances on straightness and flatness, by nominal length. */
export const STRAIGHTNESS_FLATNESS: Table<GeometricClass> = {
	from: '0',
	upTo: ['10', '30', '100', '300', '1000', '3000'],
	values: {
		H: ['0.02', '0.05', '0.1', '0.2', '0.3', '0.4'],
		K: ['0.05', '0.1', '0.2', '0.4', '0.6', '0.8'],
		L: ['0.1', '0.2', '0.4', '0.8', '1.2', '1.6']
	}
};

/** ISO 2768-2:1989, table 2: general tolerances on perpendicularity, by the shorter side. */
export const PERPENDICULARITY: Table<GeometricClass> = {
	from: '0',
	upTo: ['100', '300', '1000', '3000'],
	values: {
		H: ['0.2', '0.3', '0.4', '0.5'],
		K: ['0.4', '0.6', '0.8', '1'],
		L: ['0.6', '1', '1.5', '2']
	}
};

/** ISO 2768-2:1989, table 3: general tolerances on symmetry, by nominal length. */
export const SYMMETRY: Table<GeometricClass> = {
	from: '0',
	upTo: ['100', '300', '1000', '3000'],
	values: {
		H: ['0.5', '0.5', '0.5', '0.5'],
		K: ['0.6', '0.6', '0.8', '1'],
		L: ['0.6', '1', '1.5', '2']
	}
};

/** ISO 2768-2:1989, table 4: general tolerances on circular run-out. */
export const CIRCULAR_RUNOUT: Readonly<Record<GeometricClass, string>> = {
	H: '0.1',
	K: '0.2',
	L: '0.5'
};

export const ISO_2768_2_STATUS = {
	withdrawn: 2021,
	replacedBy: 'ISO 22081',
	note: 'ISO 2768-2 was withdrawn in 2021 and replaced by ISO 22081; general geometric tolerances are still read from it for drawings that cite it.'
} as const;

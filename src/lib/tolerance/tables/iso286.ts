/*
 * ISO 286-1:2010 tables, as published, for every nominal size range the standard defines
 * (to 3150 mm). Values are in micrometres: whole numbers for the fundamental deviations and
 * decimal strings for the standard tolerances (IT01 to IT4 have tenths).
 *
 * Sources:
 *  - STANDARD_TOLERANCES: ISO 286-1:2010, table 1 (IT1–IT18) and annex A, table A.1 (IT01, IT0,
 *    to 500 mm only). Values recalled from memory; the Δ table below, which the standard
 *    derives from the same rows, agrees with them cell by cell.
 *  - SHAFT_DEVIATIONS, J_SHAFT, K_SHAFT: ISO 286-1:2010, table 2. Recalled from memory,
 *    cross-checked against the worked examples of ISO 286-2:2010 (e.g. g6, p6, m6, s6, u6 rows).
 *  - J_HOLE, DELTA: ISO 286-1:2010, table 3. Recalled from memory.
 * A range [upTo, value] reads "over the previous upTo, up to and including upTo"; the first
 * range starts above 0. null marks a cell the standard leaves blank (not defined).
 */

/** Main nominal size ranges (table 1), upper bounds in mm. */
export const MAIN_RANGES_MM = [
	3, 6, 10, 18, 30, 50, 80, 120, 180, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500,
	3150
] as const;

export const GRADES = [
	'IT01',
	'IT0',
	'IT1',
	'IT2',
	'IT3',
	'IT4',
	'IT5',
	'IT6',
	'IT7',
	'IT8',
	'IT9',
	'IT10',
	'IT11',
	'IT12',
	'IT13',
	'IT14',
	'IT15',
	'IT16',
	'IT17',
	'IT18'
] as const;

export type Grade = (typeof GRADES)[number];

/**
 * Standard tolerance values in µm, one row per main range, columns IT01, IT0, IT1 … IT18.
 * IT01 and IT0 are not given above 500 mm (null). IT14 to IT18 are not used up to 1 mm
 * (note a of table 1, applied in code). IT1 to IT5 above 500 mm are given "for experimental use".
 */
export const STANDARD_TOLERANCES: readonly (readonly (string | null)[])[] = [
	// prettier-ignore
	['0.3', '0.5', '0.8', '1.2', '2', '3', '4', '6', '10', '14', '25', '40', '60', '100', '140', '250', '400', '600', '1000', '1400'],
	// prettier-ignore
	['0.4', '0.6', '1', '1.5', '2.5', '4', '5', '8', '12', '18', '30', '48', '75', '120', '180', '300', '480', '750', '1200', '1800'],
	// prettier-ignore
	['0.4', '0.6', '1', '1.5', '2.5', '4', '6', '9', '15', '22', '36', '58', '90', '150', '220', '360', '580', '900', '1500', '2200'],
	// prettier-ignore
	['0.5', '0.8', '1.2', '2', '3', '5', '8', '11', '18', '27', '43', '70', '110', '180', '270', '430', '700', '1100', '1800', '2700'],
	// prettier-ignore
	['0.6', '1', '1.5', '2.5', '4', '6', '9', '13', '21', '33', '52', '84', '130', '210', '330', '520', '840', '1300', '2100', '3300'],
	// prettier-ignore
	['0.6', '1', '1.5', '2.5', '4', '7', '11', '16', '25', '39', '62', '100', '160', '250', '390', '620', '1000', '1600', '2500', '3900'],
	// prettier-ignore
	['0.8', '1.2', '2', '3', '5', '8', '13', '19', '30', '46', '74', '120', '190', '300', '460', '740', '1200', '1900', '3000', '4600'],
	// prettier-ignore
	['1', '1.5', '2.5', '4', '6', '10', '15', '22', '35', '54', '87', '140', '220', '350', '540', '870', '1400', '2200', '3500', '5400'],
	// prettier-ignore
	['1.2', '2', '3.5', '5', '8', '12', '18', '25', '40', '63', '100', '160', '250', '400', '630', '1000', '1600', '2500', '4000', '6300'],
	// prettier-ignore
	['2', '3', '4.5', '7', '10', '14', '20', '29', '46', '72', '115', '185', '290', '460', '720', '1150', '1850', '2900', '4600', '7200'],
	// prettier-ignore
	['2.5', '4', '6', '8', '12', '16', '23', '32', '52', '81', '130', '210', '320', '520', '810', '1300', '2100', '3200', '5200', '8100'],
	// prettier-ignore
	['3', '5', '7', '9', '13', '18', '25', '36', '57', '89', '140', '230', '360', '570', '890', '1400', '2300', '3600', '5700', '8900'],
	// prettier-ignore
	['4', '6', '8', '10', '15', '20', '27', '40', '63', '97', '155', '250', '400', '630', '970', '1550', '2500', '4000', '6300', '9700'],
	// prettier-ignore
	[null, null, '9', '11', '16', '22', '32', '44', '70', '110', '175', '280', '440', '700', '1100', '1750', '2800', '4400', '7000', '11000'],
	// prettier-ignore
	[null, null, '10', '13', '18', '25', '36', '50', '80', '125', '200', '320', '500', '800', '1250', '2000', '3200', '5000', '8000', '12500'],
	// prettier-ignore
	[null, null, '11', '15', '21', '28', '40', '56', '90', '140', '230', '360', '560', '900', '1400', '2300', '3600', '5600', '9000', '14000'],
	// prettier-ignore
	[null, null, '13', '18', '24', '33', '47', '66', '105', '165', '260', '420', '660', '1050', '1650', '2600', '4200', '6600', '10500', '16500'],
	// prettier-ignore
	[null, null, '15', '21', '29', '39', '55', '78', '125', '195', '310', '500', '780', '1250', '1950', '3100', '5000', '7800', '12500', '19500'],
	// prettier-ignore
	[null, null, '18', '25', '35', '46', '65', '92', '150', '230', '370', '600', '920', '1500', '2300', '3700', '6000', '9200', '15000', '23000'],
	// prettier-ignore
	[null, null, '22', '30', '41', '55', '78', '110', '175', '280', '440', '700', '1100', '1750', '2800', '4400', '7000', '11000', '17500', '28000'],
	// prettier-ignore
	[null, null, '26', '36', '50', '68', '96', '135', '210', '330', '540', '860', '1350', '2100', '3300', '5400', '8600', '13500', '21000', '33000']
];

/** [upTo mm, deviation µm | null]: "over the previous bound up to and including upTo". */
export type Steps = readonly (readonly [upTo: number, deviation: number | null])[];

/** The main ranges with one value each (for positions tabulated by main range only). */
function byMainRange(values: readonly (number | null)[]): Steps {
	return values.map((v, i) => [MAIN_RANGES_MM[i], v] as const);
}

/** Intermediate ranges to 500 mm (table 2, columns a–c and r–zc). */
const FINE_TO_500 = [
	3, 6, 10, 14, 18, 24, 30, 40, 50, 65, 80, 100, 120, 140, 160, 180, 200, 225, 250, 280, 315, 355,
	400, 450, 500
] as const;
/** Intermediate ranges above 500 mm (table 2, columns r, s, t, u). */
const FINE_ABOVE_500 = [
	560, 630, 710, 800, 900, 1000, 1120, 1250, 1400, 1600, 1800, 2000, 2240, 2500, 2800, 3150
] as const;

function byFineRange(to500: readonly (number | null)[], above500: readonly number[] = []): Steps {
	return [
		...to500.map((v, i) => [FINE_TO_500[i], v] as const),
		...above500.map((v, i) => [FINE_ABOVE_500[i], v] as const)
	];
}

/**
 * Shaft fundamental deviations in µm: the upper deviation es for a to h, the lower deviation
 * ei for k to zc (js, j and k are handled apart). A position ends where its column ends.
 */
export const SHAFT_DEVIATIONS: Readonly<Record<string, Steps>> = {
	// a and b are not used for nominal sizes up to 1 mm (note to table 2).
	// prettier-ignore
	a: byFineRange([-270, -270, -280, -290, -290, -300, -300, -310, -320, -340, -360, -380, -410, -460, -520, -580, -660, -740, -820, -920, -1050, -1200, -1350, -1500, -1650]),
	// prettier-ignore
	b: byFineRange([-140, -140, -150, -150, -150, -160, -160, -170, -180, -190, -200, -220, -240, -260, -280, -310, -340, -380, -420, -480, -540, -600, -680, -760, -840]),
	// prettier-ignore
	c: byFineRange([-60, -70, -80, -95, -95, -110, -110, -120, -130, -140, -150, -170, -180, -200, -210, -230, -240, -260, -280, -300, -330, -360, -400, -440, -480]),
	cd: byMainRange([-34, -46, -56]),
	// prettier-ignore
	d: byMainRange([-20, -30, -40, -50, -65, -80, -100, -120, -145, -170, -190, -210, -230, -260, -290, -320, -350, -390, -430, -480, -520]),
	// prettier-ignore
	e: byMainRange([-14, -20, -25, -32, -40, -50, -60, -72, -85, -100, -110, -125, -135, -145, -160, -170, -195, -220, -240, -260, -290]),
	ef: byMainRange([-10, -14, -18]),
	// prettier-ignore
	f: byMainRange([-6, -10, -13, -16, -20, -25, -30, -36, -43, -50, -56, -62, -68, -76, -80, -86, -98, -110, -120, -130, -145]),
	fg: byMainRange([-4, -6, -8]),
	// prettier-ignore
	g: byMainRange([-2, -4, -5, -6, -7, -9, -10, -12, -14, -15, -17, -18, -20, -22, -24, -26, -28, -30, -32, -34, -38]),
	h: byMainRange(MAIN_RANGES_MM.map(() => 0)),
	// prettier-ignore
	m: byMainRange([2, 4, 6, 7, 8, 9, 11, 13, 15, 17, 20, 21, 23, 26, 30, 34, 40, 48, 58, 68, 76]),
	// prettier-ignore
	n: byMainRange([4, 8, 10, 12, 15, 17, 20, 23, 27, 31, 34, 37, 40, 44, 50, 56, 66, 78, 92, 110, 135]),
	// prettier-ignore
	p: byMainRange([6, 12, 15, 18, 22, 26, 32, 37, 43, 50, 56, 62, 68, 78, 88, 100, 120, 140, 170, 195, 240]),
	r: byFineRange(
		// prettier-ignore
		[10, 15, 19, 23, 23, 28, 28, 34, 34, 41, 43, 51, 54, 63, 65, 68, 77, 80, 84, 94, 98, 108, 114, 126, 132],
		[150, 155, 175, 185, 210, 220, 250, 260, 300, 330, 370, 400, 440, 460, 550, 580]
	),
	s: byFineRange(
		// prettier-ignore
		[14, 19, 23, 28, 28, 35, 35, 43, 43, 53, 59, 71, 79, 92, 100, 108, 122, 130, 140, 158, 170, 190, 208, 232, 252],
		[280, 310, 340, 380, 430, 470, 520, 580, 640, 720, 820, 920, 1000, 1100, 1250, 1350]
	),
	t: byFineRange(
		// prettier-ignore
		[null, null, null, null, null, null, 41, 48, 54, 66, 75, 91, 104, 122, 134, 146, 166, 180, 196, 218, 240, 268, 294, 330, 360],
		[400, 450, 500, 560, 620, 680, 780, 840, 960, 1050, 1200, 1350, 1500, 1650, 1900, 2100]
	),
	u: byFineRange(
		// prettier-ignore
		[18, 23, 28, 33, 33, 41, 48, 60, 70, 87, 102, 124, 144, 170, 190, 210, 236, 258, 284, 315, 350, 390, 435, 490, 540],
		[600, 660, 740, 840, 940, 1050, 1150, 1300, 1450, 1600, 1850, 2000, 2300, 2500, 2900, 3200]
	),
	// prettier-ignore
	v: byFineRange([null, null, null, null, 39, 47, 55, 68, 81, 102, 120, 146, 172, 202, 228, 252, 284, 310, 340, 385, 425, 475, 530, 595, 660]),
	// prettier-ignore
	x: byFineRange([20, 28, 34, 40, 45, 54, 64, 80, 97, 122, 146, 178, 210, 248, 280, 310, 350, 385, 425, 475, 525, 590, 660, 740, 820]),
	// prettier-ignore
	y: byFineRange([null, null, null, null, null, 63, 75, 94, 114, 144, 174, 214, 254, 300, 340, 380, 425, 470, 520, 580, 650, 730, 820, 920, 1000]),
	// prettier-ignore
	z: byFineRange([26, 35, 42, 50, 60, 73, 88, 112, 136, 172, 210, 258, 310, 365, 415, 465, 520, 575, 640, 710, 790, 900, 1000, 1100, 1250]),
	// prettier-ignore
	za: byFineRange([32, 42, 52, 64, 77, 98, 118, 148, 180, 226, 274, 335, 400, 470, 535, 600, 670, 740, 820, 920, 1000, 1150, 1300, 1450, 1600]),
	// prettier-ignore
	zb: byFineRange([40, 50, 67, 90, 108, 136, 160, 200, 242, 300, 360, 445, 525, 620, 700, 780, 880, 960, 1050, 1200, 1300, 1500, 1650, 1850, 2100]),
	// prettier-ignore
	zc: byFineRange([60, 80, 97, 130, 150, 188, 218, 274, 325, 405, 480, 585, 690, 800, 900, 1000, 1150, 1250, 1350, 1550, 1700, 1900, 2100, 2400, 2600])
};

/** Shaft j, lower deviation ei in µm, by grade (table 2); j8 only up to 3 mm; none above 500 mm. */
export const J_SHAFT: Readonly<Record<'5-6' | '7' | '8', Steps>> = {
	'5-6': byMainRange([-2, -2, -2, -3, -4, -5, -7, -9, -11, -13, -16, -18, -20]),
	'7': byMainRange([-4, -4, -5, -6, -8, -10, -12, -15, -18, -21, -26, -28, -32]),
	'8': byMainRange([-6])
};

/** Shaft k, lower deviation ei in µm for IT4 to IT7 (table 2); 0 for ≤ IT3, > IT7 and above 500 mm. */
export const K_SHAFT_IT4_TO_IT7: Steps = byMainRange([0, 1, 1, 1, 2, 2, 2, 3, 3, 4, 4, 4, 5]);

/** Hole J, upper deviation ES in µm, by grade (table 3); none above 500 mm. */
export const J_HOLE: Readonly<Record<'6' | '7' | '8', Steps>> = {
	'6': byMainRange([2, 5, 5, 6, 8, 10, 13, 16, 18, 22, 25, 29, 33]),
	'7': byMainRange([4, 6, 8, 10, 12, 14, 18, 22, 26, 30, 36, 39, 43]),
	'8': byMainRange([6, 10, 12, 15, 20, 24, 28, 34, 41, 47, 55, 60, 66])
};

/**
 * Δ in µm (table 3) for grades IT3 to IT8, one row per main range to 500 mm: added to the
 * hole ES of K, M, N up to IT8 and of P to ZC up to IT7. Over 3 mm, Δ = ITn − IT(n−1).
 */
export const DELTA: readonly (readonly string[])[] = [
	['0', '0', '0', '0', '0', '0'],
	['1', '1.5', '1', '3', '4', '6'],
	['1', '1.5', '2', '3', '6', '7'],
	['1', '2', '3', '3', '7', '9'],
	['1.5', '2', '3', '4', '8', '12'],
	['1.5', '3', '4', '5', '9', '14'],
	['2', '3', '5', '6', '11', '16'],
	['2', '4', '5', '7', '13', '19'],
	['3', '4', '6', '7', '15', '23'],
	['3', '4', '6', '9', '17', '26'],
	['4', '4', '7', '9', '20', '29'],
	['4', '5', '7', '11', '21', '32'],
	['5', '5', '7', '13', '23', '34']
];

/** ISO 286-1:2010 table 3, footnote: M6 from 250 to 315 mm has ES = −9 µm, not −11. */
export const M6_250_TO_315_ES = -9;

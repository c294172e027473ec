import {
	appendBezierCurve,
	clip,
	closePath,
	endPath,
	fill,
	lineTo,
	moveTo,
	popGraphicsState,
	pushGraphicsState,
	setDashPattern,
	setFillingGrayscaleColor,
	setLineWidth,
	setStrokingGrayscaleColor,
	stroke,
	type PDFFont,
	type PDFOperator,
	type PDFPage
} from 'pdf-lib';

/** A point on the sheet in millimetres from its top-left corner. */
export type Pt = [x: number, y: number];

export type CalloutKind = 'size' | 'dimension' | 'basic' | 'frame' | 'datum' | 'note';

/** A piece of drawn text that later work can find, with where it sits on the page. */
export interface DemoCallout {
	text: string;
	sheet: number;
	/** Centre of the text (of the whole frame for a feature control frame), 0..1 from the left. */
	x: number;
	/** 0..1 from the top of the page. */
	y: number;
	/** The text's width, 0..1 of the page's width (so a balloon can sit beside it). */
	w: number;
	kind: CalloutKind;
	/** What the callout belongs to, in the words a checker would use. */
	label: string;
}

export type LineStyle = 'thick' | 'thin' | 'hidden' | 'centre' | 'border' | 'frame';

const MM = 72 / 25.4;
const CAP = 0.73; // DejaVu Sans capital height per em
const ARROW = 3;

const styles: Record<LineStyle, { width: number; dash?: number[] }> = {
	thick: { width: 0.5 },
	thin: { width: 0.25 },
	hidden: { width: 0.3, dash: [3, 1.2] },
	centre: { width: 0.25, dash: [12, 1.5, 1.5, 1.5] },
	border: { width: 0.7 },
	frame: { width: 0.35 }
};

export interface SheetFonts {
	text: PDFFont;
	bold: PDFFont;
	symbols: PDFFont;
	marks: PDFFont;
	/** Which face has a glyph for a code point. */
	has: (face: 'text' | 'symbols' | 'marks', codePoint: number) => boolean;
}

export interface TextOptions {
	/** Capital height in millimetres (ISO 3098 h). */
	h?: number;
	align?: 'start' | 'middle' | 'end';
	bold?: boolean;
	/** `at` is on the baseline rather than at the middle of the capitals. */
	baseline?: boolean;
}

const gdtSymbols = new Set([...'⌀⏤⏥○⌭⌒⌓⊥∠∥◎⌯↗⌰ⓂⓁⒺⒾⒻⓅⓈⓉⓊ⌖']);

/** Builds a path in sheet millimetres; angles in degrees, counter-clockwise as seen. */
export class PathBuilder {
	readonly ops: PDFOperator[] = [];
	constructor(private readonly pageHeight: number) {}

	private px(p: Pt): [number, number] {
		return [p[0] * MM, (this.pageHeight - p[1]) * MM];
	}
	move(p: Pt) {
		this.ops.push(moveTo(...this.px(p)));
		return this;
	}
	line(p: Pt) {
		this.ops.push(lineTo(...this.px(p)));
		return this;
	}
	close() {
		this.ops.push(closePath());
		return this;
	}
	poly(points: Pt[], closed = false) {
		points.forEach((p, i) => (i === 0 ? this.move(p) : this.line(p)));
		if (closed) this.close();
		return this;
	}
	/** An arc from angle a0 to a1, starting a new subpath unless `join`. */
	arc(c: Pt, r: number, a0: number, a1: number, join = false) {
		const at = (a: number): Pt => [c[0] + r * Math.cos(a), c[1] - r * Math.sin(a)];
		const start = (a0 * Math.PI) / 180;
		const sweep = ((a1 - a0) * Math.PI) / 180;
		const pieces = Math.max(1, Math.ceil(Math.abs(sweep) / (Math.PI / 2) - 1e-9));
		const step = sweep / pieces;
		const k = (4 / 3) * Math.tan(step / 4);
		if (join) this.line(at(start));
		else this.move(at(start));
		for (let i = 0; i < pieces; i++) {
			const t0 = start + i * step;
			const t1 = t0 + step;
			const p0 = at(t0);
			const p3 = at(t1);
			const c1: Pt = [p0[0] - k * r * Math.sin(t0), p0[1] - k * r * Math.cos(t0)];
			const c2: Pt = [p3[0] + k * r * Math.sin(t1), p3[1] + k * r * Math.cos(t1)];
			this.ops.push(appendBezierCurve(...this.px(c1), ...this.px(c2), ...this.px(p3)));
		}
		return this;
	}
	circle(c: Pt, r: number) {
		return this.arc(c, r, 0, 360).close();
	}
	rect(x: number, y: number, w: number, h: number) {
		return this.poly(
			[
				[x, y],
				[x + w, y],
				[x + w, y + h],
				[x, y + h]
			],
			true
		);
	}
}

/**
 * One drawing sheet. Without a page it only records callouts: the positions it records
 * come from geometry alone, never from measured text, so a dry run gives the same list.
 */
export class Sheet {
	readonly callouts: DemoCallout[] = [];

	constructor(
		readonly width: number,
		readonly height: number,
		private readonly page: PDFPage | null,
		private readonly fonts: SheetFonts | null,
		readonly sheetNumber = 1
	) {}

	path() {
		return new PathBuilder(this.height);
	}

	stroke(path: PathBuilder, style: LineStyle) {
		if (!this.page) return;
		const { width, dash } = styles[style];
		this.page.pushOperators(
			pushGraphicsState(),
			setStrokingGrayscaleColor(0),
			setLineWidth(width * MM),
			setDashPattern(
				(dash ?? []).map((d) => d * MM),
				0
			),
			...path.ops,
			stroke(),
			popGraphicsState()
		);
	}

	fill(path: PathBuilder, gray = 0) {
		if (!this.page) return;
		this.page.pushOperators(
			pushGraphicsState(),
			setFillingGrayscaleColor(gray),
			...path.ops,
			fill(),
			popGraphicsState()
		);
	}

	/** Section hatching at 45° inside a region (non-zero winding). */
	hatch(region: PathBuilder, box: [x: number, y: number, w: number, h: number], pitch = 2) {
		if (!this.page) return;
		const [x, y, w, h] = box;
		const lines = this.path();
		for (let d = -h; d <= w; d += pitch) {
			lines.move([x + d, y + h]).line([x + d + h, y]);
		}
		this.page.pushOperators(pushGraphicsState(), ...region.ops, clip(), endPath());
		this.stroke(lines, 'thin');
		this.page.pushOperators(popGraphicsState());
	}

	line(a: Pt, b: Pt, style: LineStyle = 'thick') {
		this.stroke(this.path().move(a).line(b), style);
	}

	poly(points: Pt[], style: LineStyle = 'thick', closed = true) {
		this.stroke(this.path().poly(points, closed), style);
	}

	rect(x: number, y: number, w: number, h: number, style: LineStyle = 'thick') {
		this.stroke(this.path().rect(x, y, w, h), style);
	}

	circle(c: Pt, r: number, style: LineStyle = 'thick') {
		this.stroke(this.path().circle(c, r), style);
	}

	arc(c: Pt, r: number, a0: number, a1: number, style: LineStyle = 'thick') {
		this.stroke(this.path().arc(c, r, a0, a1), style);
	}

	/** Centre lines of a circle, reaching past it. */
	centreMark(c: Pt, r: number, reach = 3) {
		this.line([c[0] - r - reach, c[1]], [c[0] + r + reach, c[1]], 'centre');
		this.line([c[0], c[1] - r - reach], [c[0], c[1] + r + reach], 'centre');
	}

	private faceFor(
		ch: string,
		bold: boolean
	): { font: PDFFont; face: 'text' | 'symbols' | 'marks' } {
		const fonts = this.fonts!;
		const cp = ch.codePointAt(0)!;
		if (gdtSymbols.has(ch) && fonts.has('symbols', cp))
			return { font: fonts.symbols, face: 'symbols' };
		if (fonts.has('text', cp)) return { font: bold ? fonts.bold : fonts.text, face: 'text' };
		if (fonts.has('symbols', cp)) return { font: fonts.symbols, face: 'symbols' };
		if (fonts.has('marks', cp)) return { font: fonts.marks, face: 'marks' };
		throw new Error(`No drawing face has a glyph for ${ch} (U+${cp.toString(16).toUpperCase()})`);
	}

	/** The text split into runs that one face can set. */
	private runs(text: string, bold: boolean) {
		const runs: { text: string; font: PDFFont; face: string }[] = [];
		for (const ch of text) {
			const { font, face } =
				ch === ' ' ? (runs.at(-1) ?? this.faceFor(ch, bold)) : this.faceFor(ch, bold);
			const last = runs.at(-1);
			if (last && last.font === font) last.text += ch;
			else runs.push({ text: ch, font, face });
		}
		return runs;
	}

	private em(h: number, face: string) {
		// Noto's circled letters are 0.82 em tall: about a capital's height at this size.
		return face === 'text' ? h / CAP : (h / CAP) * 0.95;
	}

	textWidth(text: string, options: TextOptions = {}) {
		const { h = 3.5, bold = false } = options;
		if (!this.fonts) return text.length * h * 0.8;
		return this.runs(text, bold).reduce(
			(sum, run) => sum + run.font.widthOfTextAtSize(run.text, this.em(h, run.face) * MM) / MM,
			0
		);
	}

	text(text: string, at: Pt, options: TextOptions = {}) {
		const { h = 3.5, align = 'middle', bold = false, baseline = false } = options;
		if (!this.page || !this.fonts) return text.length * h * 0.8;
		const width = this.textWidth(text, options);
		let x = align === 'start' ? at[0] : align === 'end' ? at[0] - width : at[0] - width / 2;
		const base = baseline ? at[1] : at[1] + h / 2;
		for (const run of this.runs(text, bold)) {
			const size = this.em(h, run.face) * MM;
			this.page.drawText(run.text, {
				x: x * MM,
				y: (this.height - base) * MM,
				size,
				font: run.font
			});
			x += run.font.widthOfTextAtSize(run.text, size) / MM;
		}
		return width;
	}

	record(text: string, at: Pt, kind: CalloutKind, label: string) {
		this.callouts.push({
			text,
			sheet: this.sheetNumber,
			x: round4(at[0] / this.width),
			y: round4(at[1] / this.height),
			w: round4(this.textWidth(text) / this.width),
			kind,
			label
		});
	}

	/** A filled arrowhead with its tip at `tip`, pointing away from `from`. */
	arrow(tip: Pt, from: Pt) {
		const dx = tip[0] - from[0];
		const dy = tip[1] - from[1];
		const len = Math.hypot(dx, dy) || 1;
		const [ux, uy] = [dx / len, dy / len];
		const back: Pt = [tip[0] - ux * ARROW, tip[1] - uy * ARROW];
		const half = ARROW / 6;
		this.fill(
			this.path().poly(
				[
					tip,
					[back[0] - uy * half, back[1] + ux * half],
					[back[0] + uy * half, back[1] - ux * half]
				],
				true
			)
		);
	}

	/**
	 * A dimension between two feature points, measured along x (`h`) or y (`v`), with its
	 * line at `at` (a y for `h`, an x for `v`). The text sits above a horizontal line and
	 * in a gap of a vertical one, read from the bottom of the sheet (unidirectional).
	 * Returns where the text sits.
	 */
	dimension(
		a: Pt,
		b: Pt,
		direction: 'h' | 'v',
		at: number,
		text: string,
		options: {
			label?: string;
			kind?: CalloutKind;
			shift?: number;
			basic?: boolean;
			record?: boolean;
		} = {}
	): Pt {
		const { shift = 0, kind = 'dimension', basic = false } = options;
		const h = 3.5;
		let centre: Pt;
		if (direction === 'h') {
			const [x1, x2] = a[0] < b[0] ? [a[0], b[0]] : [b[0], a[0]];
			const [y1, y2] = a[0] < b[0] ? [a[1], b[1]] : [b[1], a[1]];
			const sign1 = at < y1 ? -1 : 1;
			const sign2 = at < y2 ? -1 : 1;
			this.line([x1, y1 + sign1], [x1, at + sign1 * 2], 'thin');
			this.line([x2, y2 + sign2], [x2, at + sign2 * 2], 'thin');
			centre = [(x1 + x2) / 2 + shift, at - 1.2 - h / 2];
			this.dimLine([x1, at], [x2, at]);
		} else {
			const [y1, y2] = a[1] < b[1] ? [a[1], b[1]] : [b[1], a[1]];
			const [x1, x2] = a[1] < b[1] ? [a[0], b[0]] : [b[0], a[0]];
			const sign1 = at < x1 ? -1 : 1;
			const sign2 = at < x2 ? -1 : 1;
			this.line([x1 + sign1, y1], [at + sign1 * 2, y1], 'thin');
			this.line([x2 + sign2, y2], [at + sign2 * 2, y2], 'thin');
			centre = [at, (y1 + y2) / 2 + shift];
			const gap = h / 2 + 1.5;
			if (centre[1] - gap > y1 + 2 * ARROW && centre[1] + gap < y2 - 2 * ARROW) {
				this.dimLine([at, y1], [at, y2], [at, centre[1] - gap], [at, centre[1] + gap]);
			} else {
				this.dimLine([at, y1], [at, y2]);
				centre = [at - 1.5 - (text.length * h * 0.8) / 2, centre[1]];
			}
		}
		this.dimensionText(text, centre, { basic });
		if (options.record !== false)
			this.record(text, centre, basic ? 'basic' : kind, options.label ?? text);
		return centre;
	}

	/** A dimension line from p to q (optionally broken between r and s), arrows at p and q. */
	private dimLine(p: Pt, q: Pt, r?: Pt, s?: Pt) {
		const length = Math.hypot(q[0] - p[0], q[1] - p[1]);
		if (length < 4 * ARROW) {
			// Too short for arrows inside: put them outside, pointing in.
			const [ux, uy] = [(q[0] - p[0]) / length, (q[1] - p[1]) / length];
			const p2: Pt = [p[0] - ux * (ARROW + 3), p[1] - uy * (ARROW + 3)];
			const q2: Pt = [q[0] + ux * (ARROW + 3), q[1] + uy * (ARROW + 3)];
			this.line(p2, q2, 'thin');
			this.arrow(p, p2);
			this.arrow(q, q2);
			return;
		}
		if (r && s) {
			this.line(p, r, 'thin');
			this.line(s, q, 'thin');
		} else {
			this.line(p, q, 'thin');
		}
		this.arrow(p, q);
		this.arrow(q, p);
	}

	dimensionText(text: string, centre: Pt, options: { basic?: boolean } = {}) {
		const width = this.text(text, centre);
		if (options.basic) {
			this.rect(centre[0] - width / 2 - 1, centre[1] - 2.75, width + 2, 5.5, 'thin');
		}
	}

	/**
	 * A leader from an arrowhead at `tip` to a callout centred at `textAt`, ending in a
	 * short horizontal shoulder under the text's near end.
	 */
	leader(tip: Pt, textAt: Pt, text: string, label: string, kind: CalloutKind = 'size', extend = 0) {
		const width = this.text(text, textAt);
		const toRight = textAt[0] >= tip[0];
		const near = toRight ? textAt[0] - width / 2 - 1 : textAt[0] + width / 2 + 1;
		const shoulderY = textAt[1] + 3;
		const elbow: Pt = [near + (toRight ? -3 : 3), shoulderY];
		this.line(tip, elbow, 'thin');
		const far = near + (toRight ? width + 2 + extend : -width - 2 - extend);
		this.line(elbow, [far, shoulderY], 'thin');
		this.arrow(tip, elbow);
		this.record(text, textAt, kind, label);
	}

	/** A leader to a hole: the arrow meets the circle on a line through its centre. */
	holeLeader(c: Pt, r: number, angle: number, textAt: Pt, text: string, label: string, extend = 0) {
		const a = (angle * Math.PI) / 180;
		const tip: Pt = [c[0] + r * Math.cos(a), c[1] - r * Math.sin(a)];
		this.leader(tip, textAt, text, label, 'size', extend);
	}

	/** Cell widths of a feature control frame, from character counts so dry runs agree. */
	static frameCells(cells: string[], h = 7) {
		return cells.map((cell, i) => (i === 0 ? h : Math.max(h, [...cell].length * 2.7 + 3)));
	}

	/** A feature control frame centred at `centre`. Returns its left and right x. */
	frame(centre: Pt, cells: string[], label: string, h = 7): [number, number] {
		const widths = Sheet.frameCells(cells, h);
		const total = widths.reduce((a, b) => a + b, 0);
		let x = centre[0] - total / 2;
		const top = centre[1] - h / 2;
		this.rect(x, top, total, h, 'frame');
		cells.forEach((cell, i) => {
			if (i > 0) this.line([x, top], [x, top + h], 'frame');
			this.text(cell, [x + widths[i] / 2, centre[1]], { h: i === 0 ? 3.5 : 3.2 });
			x += widths[i];
		});
		this.record(cells.join(' '), centre, 'frame', label);
		return [centre[0] - total / 2, centre[0] + total / 2];
	}

	/** A datum feature symbol: letter in a box, joined to a filled triangle on the feature. */
	datum(letter: string, foot: Pt, boxCentre: Pt, label: string) {
		const size = 6;
		const dx = boxCentre[0] - foot[0];
		const dy = boxCentre[1] - foot[1];
		const len = Math.hypot(dx, dy);
		const [ux, uy] = [dx / len, dy / len];
		const apex: Pt = [foot[0] + ux * 2.4, foot[1] + uy * 2.4];
		this.fill(
			this.path().poly(
				[[foot[0] - uy * 1.6, foot[1] + ux * 1.6], [foot[0] + uy * 1.6, foot[1] - ux * 1.6], apex],
				true
			)
		);
		const edge: Pt = [boxCentre[0] - ux * (size / 2), boxCentre[1] - uy * (size / 2)];
		this.line(apex, edge, 'thin');
		this.rect(boxCentre[0] - size / 2, boxCentre[1] - size / 2, size, size, 'frame');
		this.text(letter, boxCentre);
		this.record(letter, boxCentre, 'datum', label);
	}
}

export function round4(n: number) {
	return Math.round(n * 10000) / 10000;
}

/** Maps part coordinates (y up, in part units) onto the sheet at a scale. */
export function viewOf(origin: Pt, scale: number) {
	return (u: number, v: number): Pt => [origin[0] + u * scale, origin[1] - v * scale];
}

/*
 * The fit diagram: hole and shaft tolerance zones drawn to scale against the zero line (the
 * basic size), limits at the zone edges, clearances marked between the zones. Sized for a
 * 320 px wide panel; pixel positions are the only non-integer values here, never sizes.
 */
import { formatLength, type Length } from './decimal';
import type { FitEvaluation } from './fit';

const WIDTH = 320;
const TOP = 40;
const PLOT = 150;
const HEIGHT = TOP + PLOT + 76;
const HOLE_X = 78;
const SHAFT_X = 186;
const ZONE_W = 56;
const LABEL_GAP = 12;

const SANS = "'Noto Sans', sans-serif";
const MONO = "'Noto Sans Mono', monospace";
const INK = '#1f2933';
const MUTED = '#5f6b7a';
const LINE = '#d9dee5';
const ACCENT = '#1d5fa8';
const CRITICAL = '#b42318';

function escape(text: string): string {
	return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function text(
	x: number,
	y: number,
	content: string,
	opts: { anchor?: string; mono?: boolean; fill?: string; size?: number; weight?: number } = {}
) {
	return `<text x="${x.toFixed(1)}" y="${y.toFixed(1)}" font-family="${opts.mono ? MONO : SANS}" font-size="${opts.size ?? 11}"${opts.weight ? ` font-weight="${opts.weight}"` : ''} fill="${opts.fill ?? INK}" text-anchor="${opts.anchor ?? 'start'}">${escape(content)}</text>`;
}

/** A limit value on a white backing, so the zero line never runs through it (reads as a minus). */
function limitLabel(x: number, y: number, content: string, anchor: 'start' | 'end') {
	const w = content.length * 6.1 + 4;
	const left = anchor === 'end' ? x - w + 2 : x - 2;
	return `<rect x="${left.toFixed(1)}" y="${(y - 9).toFixed(1)}" width="${w.toFixed(1)}" height="12" fill="#ffffff"/>${text(x, y, content, { anchor, mono: true, size: 10 })}`;
}

/** Spreads two edge labels so they never overlap; returns their baselines. */
function labelPair(yUpper: number, yLower: number): [number, number] {
	let a = yUpper + 4;
	let b = yLower + 4;
	if (b - a < LABEL_GAP) {
		const mid = (a + b) / 2;
		a = mid - LABEL_GAP / 2;
		b = mid + LABEL_GAP / 2;
	}
	return [a, b];
}

function arrow(x: number, y1: number, y2: number, colour: string): string {
	const head = (y: number, down: boolean) =>
		`<path d="M${x - 3} ${(down ? y - 5 : y + 5).toFixed(1)} L${x} ${y.toFixed(1)} L${x + 3} ${(down ? y - 5 : y + 5).toFixed(1)}" fill="none" stroke="${colour}" stroke-width="1"/>`;
	const top = Math.min(y1, y2);
	const bottom = Math.max(y1, y2);
	const heads = bottom - top >= 8 ? head(top, false) + head(bottom, true) : '';
	return `<line x1="${x}" y1="${top.toFixed(1)}" x2="${x}" y2="${bottom.toFixed(1)}" stroke="${colour}" stroke-width="1"/>${heads}`;
}

/** An SVG string of the fit, or of a short message when the fit has no two limits per member. */
export function fitDiagramSvg(fit: FitEvaluation): string {
	const { hole, shaft, units } = fit;
	const open = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${HEIGHT}" width="${WIDTH}" height="${HEIGHT}" role="img" aria-labelledby="fit-diagram-title">`;
	if (hole.upper === null || hole.lower === null || shaft.upper === null || shaft.lower === null) {
		return `${open}<title id="fit-diagram-title">Fit diagram unavailable</title>${text(WIDTH / 2, HEIGHT / 2, 'Both members need two limits to draw the fit', { anchor: 'middle', fill: MUTED })}</svg>`;
	}
	const basic = fit.basicSize ?? hole.lower;
	const dev = (v: Length) => v - basic;
	const values = [0, dev(hole.upper), dev(hole.lower), dev(shaft.upper), dev(shaft.lower)];
	const hi = Math.max(...values);
	const lo = Math.min(...values);
	const span = hi - lo || 1;
	const y = (v: Length) => TOP + ((hi - dev(v)) / span) * PLOT;
	const yZero = TOP + (hi / span) * PLOT;
	const places = fit.places;
	const f = (v: Length) => formatLength(v, units, places);
	const zone = (x: number, upper: Length, lower: Length, fill: string, stroke: string) => {
		const top = y(upper);
		const h = Math.max(1.5, y(lower) - top);
		return `<rect x="${x}" y="${top.toFixed(1)}" width="${ZONE_W}" height="${h.toFixed(1)}" fill="${fill}" stroke="${stroke}" stroke-width="1.5"/>`;
	};
	const [hu, hl] = labelPair(y(hole.upper), y(hole.lower));
	const [su, sl] = labelPair(y(shaft.upper), y(shaft.lower));
	const minC = fit.minClearance as Length;
	const maxC = fit.maxClearance as Length;
	const minColour = minC < 0 ? CRITICAL : INK;
	const basicText = formatLength(basic, units, Math.min(places, hole.places));
	const title = `Fit diagram: hole ${f(hole.lower)} to ${f(hole.upper)}, shaft ${f(shaft.lower)} to ${f(shaft.upper)}, clearance ${f(minC)} to ${f(maxC)} ${units}`;
	const parts = [
		open,
		`<title id="fit-diagram-title">${escape(title)}</title>`,
		`<rect width="${WIDTH}" height="${HEIGHT}" fill="#ffffff"/>`,
		text(HOLE_X + ZONE_W / 2, 18, 'Hole', { anchor: 'middle', weight: 600 }),
		text(SHAFT_X + ZONE_W / 2, 18, fit.memberKind === 'fastener' ? 'Fastener' : 'Shaft', {
			anchor: 'middle',
			weight: 600
		}),
		text(
			HOLE_X + ZONE_W / 2,
			31,
			hole.spec.toleranceClass?.code ?? hole.spec.fit?.hole.code ?? '',
			{ anchor: 'middle', fill: MUTED, size: 10 }
		),
		text(
			SHAFT_X + ZONE_W / 2,
			31,
			shaft.spec.toleranceClass?.code ?? shaft.spec.fit?.shaft.code ?? '',
			{ anchor: 'middle', fill: MUTED, size: 10 }
		),
		`<line x1="8" y1="${yZero.toFixed(1)}" x2="${WIDTH - 8}" y2="${yZero.toFixed(1)}" stroke="${MUTED}" stroke-width="1" stroke-dasharray="4 3"/>`,
		zone(HOLE_X, hole.upper, hole.lower, '#e6eef8', ACCENT),
		zone(SHAFT_X, shaft.upper, shaft.lower, '#eceff3', MUTED),
		limitLabel(HOLE_X - 4, hu, f(hole.upper), 'end'),
		limitLabel(HOLE_X - 4, hl, f(hole.lower), 'end'),
		limitLabel(SHAFT_X + ZONE_W + 4, su, f(shaft.upper), 'start'),
		limitLabel(SHAFT_X + ZONE_W + 4, sl, f(shaft.lower), 'start'),
		`<line x1="${HOLE_X + ZONE_W}" y1="${y(hole.lower).toFixed(1)}" x2="${SHAFT_X}" y2="${y(hole.lower).toFixed(1)}" stroke="${LINE}" stroke-width="1"/>`,
		`<line x1="${HOLE_X + ZONE_W}" y1="${y(hole.upper).toFixed(1)}" x2="${SHAFT_X}" y2="${y(hole.upper).toFixed(1)}" stroke="${LINE}" stroke-width="1"/>`,
		arrow(SHAFT_X - 26, y(hole.lower), y(shaft.upper), minColour),
		arrow(SHAFT_X - 14, y(hole.upper), y(shaft.lower), INK),
		`<line x1="8" y1="${TOP + PLOT + 14}" x2="${WIDTH - 8}" y2="${TOP + PLOT + 14}" stroke="${LINE}" stroke-width="1"/>`,
		text(8, TOP + PLOT + 32, 'Min clearance', { fill: MUTED }),
		text(WIDTH - 8, TOP + PLOT + 32, f(minC), { anchor: 'end', mono: true, fill: minColour }),
		text(8, TOP + PLOT + 50, 'Max clearance', { fill: MUTED }),
		text(WIDTH - 8, TOP + PLOT + 50, f(maxC), { anchor: 'end', mono: true }),
		text(8, TOP + PLOT + 68, 'Zero line (basic size)', { fill: MUTED }),
		text(WIDTH - 8, TOP + PLOT + 68, basicText, { anchor: 'end', mono: true }),
		'</svg>'
	];
	return parts.join('');
}

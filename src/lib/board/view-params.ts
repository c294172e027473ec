import { maxZoom, minZoom, type Point } from './view';

/**
 * The board's view in its URL, so a link from a table, a mail or a colleague opens the same
 * view: `?sheet=2&zoom=800&centre=0.41203,0.63150&show=finding-12`.
 * - `sheet`: the sheet, 1-based;
 * - `zoom`: per cent (100 = the size on paper on a 96 dpi screen); absent: the whole sheet;
 * - `centre`: the displayed page's point at the middle of the view, `x,y` in 0..1 from the
 *   top-left (the same frame as a marker's `location`); absent: the middle of the sheet;
 * - `show`: a marker to fly to and select, by its id (`feature-…`, `finding-…`).
 */
export const viewParams = {
	sheet: 'sheet',
	zoom: 'zoom',
	centre: 'centre',
	show: 'show'
} as const;

export interface ViewLink {
	sheet?: number;
	/** 1 = 100 %. */
	zoom?: number;
	centre?: Point;
	show?: string;
}

export interface ParsedViewLink {
	link: ViewLink;
	/** What was in the URL but not understood, in words; the view ignores it. */
	problems: string[];
}

const markerId = /^[A-Za-z0-9][\w.:-]{0,99}$/;
const decimal = /^\d+(\.\d+)?$/;

/** Reads the view from a URL's query; anything not understood is left out and named. */
export function parseViewLink(query: URLSearchParams, sheets: number): ParsedViewLink {
	const link: ViewLink = {};
	const problems: string[] = [];
	const sheet = query.get(viewParams.sheet);
	if (sheet !== null) {
		const number = Number(sheet);
		if (/^\d+$/.test(sheet) && number >= 1 && number <= sheets) link.sheet = number;
		else problems.push(`sheet "${sheet}" (this revision has sheets 1 to ${sheets})`);
	}
	const zoom = query.get(viewParams.zoom);
	if (zoom !== null) {
		const percent = Number(zoom);
		if (decimal.test(zoom) && percent >= minZoom * 100 && percent <= maxZoom * 100) {
			link.zoom = percent / 100;
		} else {
			problems.push(`zoom "${zoom}" (from ${minZoom * 100} to ${maxZoom * 100} per cent)`);
		}
	}
	const centre = query.get(viewParams.centre);
	if (centre !== null) {
		const parts = centre.split(',');
		const [x, y] = parts.map(Number);
		if (parts.length === 2 && parts.every((p) => decimal.test(p)) && x <= 1 && y <= 1) {
			link.centre = { x, y };
		} else {
			problems.push(`centre "${centre}" (two numbers from 0 to 1, such as 0.5,0.5)`);
		}
	}
	const show = query.get(viewParams.show);
	if (show !== null) {
		if (markerId.test(show)) link.show = show;
		else problems.push(`show "${show}" (not a marker's name)`);
	}
	return { link, problems };
}

const round = (value: number, places: number) => Number(value.toFixed(places));

/** Writes the view into `query`, replacing the board's own parameters and keeping others. */
export function writeViewLink(query: URLSearchParams, link: ViewLink): URLSearchParams {
	const next = new URLSearchParams(query);
	for (const name of Object.values(viewParams)) next.delete(name);
	if (link.sheet !== undefined) next.set(viewParams.sheet, String(link.sheet));
	if (link.zoom !== undefined) next.set(viewParams.zoom, String(round(link.zoom * 100, 1)));
	if (link.centre !== undefined) {
		next.set(viewParams.centre, `${link.centre.x.toFixed(5)},${link.centre.y.toFixed(5)}`);
	}
	if (link.show !== undefined) next.set(viewParams.show, link.show);
	return next;
}

/** `href` with the view written into its query, other parameters kept. */
export function linkedHref(href: string, link: ViewLink): string {
	const url = new URL(href);
	url.search = writeViewLink(url.searchParams, link).toString();
	return url.href;
}

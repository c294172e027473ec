import type { Pt, Sheet } from './sheet';

export interface TitleBlockInfo {
	number: string;
	title: string;
	partName: string;
	material: string;
	units: 'mm' | 'in';
	/** Lines of the tolerancing field, e.g. the governing standard and general tolerances. */
	tolerancing: string[];
	scale: string;
	size: 'A3' | 'A4';
	projection: 'first' | 'third';
	revision: string;
	revisionNote: string;
	date: string;
	drawnBy: string;
}

/** The frame, the zone grid in the margin and the centring marks (ISO 5457 margins). */
export function drawBorder(s: Sheet) {
	const [left, top, right, bottom] = [20, 10, s.width - 10, s.height - 10];
	s.rect(left, top, right - left, bottom - top, 'border');
	s.rect(left - 5, top - 5, right - left + 10, bottom - top + 10, 'thin');
	const columns = Math.round((right - left) / 50);
	const rows = Math.round((bottom - top) / 50);
	const cw = (right - left) / columns;
	const rh = (bottom - top) / rows;
	for (let i = 0; i < columns; i++) {
		const x = left + i * cw;
		if (i > 0) {
			s.line([x, top - 5], [x, top], 'thin');
			s.line([x, bottom], [x, bottom + 5], 'thin');
		}
		const label = String(i + 1);
		s.text(label, [x + cw / 2, top - 2.5], { h: 2.5 });
		s.text(label, [x + cw / 2, bottom + 2.5], { h: 2.5 });
	}
	for (let j = 0; j < rows; j++) {
		const y = top + j * rh;
		if (j > 0) {
			s.line([left - 5, y], [left, y], 'thin');
			s.line([right, y], [right + 5, y], 'thin');
		}
		const label = String.fromCharCode(65 + j);
		s.text(label, [left - 2.5, y + rh / 2], { h: 2.5 });
		s.text(label, [right + 2.5, y + rh / 2], { h: 2.5 });
	}
	const [cx, cy] = [(left + right) / 2, (top + bottom) / 2];
	s.line([cx, top - 5], [cx, top + 5], 'border');
	s.line([cx, bottom - 5], [cx, bottom + 5], 'border');
	s.line([left - 5, cy], [left + 5, cy], 'border');
	s.line([right - 5, cy], [right + 5, cy], 'border');
}

/** ISO 5456-2 projection symbol: a frustum's side view and its end view from the small end. */
function projectionSymbol(s: Sheet, centre: Pt, method: 'first' | 'third') {
	const [cx, cy] = centre;
	const [big, small, length, gap] = [4, 2.2, 9, 4];
	const coneLeft = cx - (length + gap + 2 * big) / 2;
	const coneRight = coneLeft + length;
	const [leftR, rightR] = method === 'third' ? [big, small] : [small, big];
	s.poly(
		[
			[coneLeft, cy - leftR],
			[coneRight, cy - rightR],
			[coneRight, cy + rightR],
			[coneLeft, cy + leftR]
		],
		'frame'
	);
	const circleCentre: Pt = [coneRight + gap + big, cy];
	s.circle(circleCentre, big, 'frame');
	s.circle(circleCentre, small, 'frame');
	s.line([coneLeft - 1.5, cy], [circleCentre[0] + big + 1.5, cy], 'centre');
	s.line([circleCentre[0], cy - big - 1.5], [circleCentre[0], cy + big + 1.5], 'centre');
}

/** The company mark: a stylised falcon wing over a drop, our own. */
function companyMark(s: Sheet, at: Pt) {
	const [x, y] = at;
	const wing = s.path().poly(
		[
			[x, y + 2],
			[x + 9, y - 4],
			[x + 5.5, y + 1],
			[x + 11, y - 1],
			[x + 4, y + 5]
		],
		true
	);
	s.fill(wing);
	s.fill(
		s
			.path()
			.arc([x + 9, y + 5], 1.6, 200, 340)
			.line([x + 9, y + 1.2])
			.close()
	);
}

type Cell = [x: number, y: number, w: number, h: number, label: string];

/** Our title block: 180 mm wide at the frame's bottom-right corner (ISO 7200 fields). */
export function drawTitleBlock(s: Sheet, info: TitleBlockInfo) {
	const width = 180;
	const height = 54;
	const x0 = s.width - 10 - width;
	const y0 = s.height - 10 - height;
	s.rect(x0, y0, width, height, 'border');

	const field = (cell: Cell, value: string, h = 3, bold = false) => {
		const [x, y, w, ch, label] = cell;
		s.rect(x0 + x, y0 + y, w, ch, 'frame');
		s.text(label, [x0 + x + 1.2, y0 + y + 2.4], { h: 1.6, align: 'start' });
		if (value) s.text(value, [x0 + x + 2, y0 + y + ch / 2 + 1.6], { h, align: 'start', bold });
	};

	// Company.
	s.rect(x0, y0, 62, 22, 'frame');
	companyMark(s, [x0 + 4, y0 + 8]);
	s.text('KESTREL FLUIDICS', [x0 + 18, y0 + 8], { h: 2.9, align: 'start', bold: true });
	s.text('Bench-top dosing pumps', [x0 + 18, y0 + 13.5], { h: 2, align: 'start' });
	s.text('Proprietary: do not copy or disclose', [x0 + 4, y0 + 19], { h: 1.6, align: 'start' });

	field([0, 22, 40, 10, 'DRAWN'], info.drawnBy, 2.6);
	field([40, 22, 22, 10, 'DATE'], info.date, 2.4);
	field([0, 32, 40, 10, 'CHECKED'], '', 2.6);
	field([40, 32, 22, 10, 'DATE'], '', 2.4);
	field([0, 42, 31, 12, 'SCALE'], info.scale, 3.2);
	field([31, 42, 31, 12, 'SHEET SIZE'], info.size, 3.2);

	field([62, 0, 74, 14, 'TITLE'], info.title.toUpperCase(), 4, true);
	field([62, 14, 74, 10, 'PART NAME'], info.partName, 2.8);
	field([62, 24, 74, 10, 'MATERIAL'], info.material, 2.8);
	s.rect(x0 + 62, y0 + 34, 74, 20, 'frame');
	s.text('TOLERANCING', [x0 + 63.2, y0 + 36.4], { h: 1.6, align: 'start' });
	info.tolerancing.forEach((line, i) => {
		const at: Pt = [x0 + 64, y0 + 41 + i * 4.4];
		s.text(line, at, { h: 2.3, align: 'start' });
	});

	field([136, 0, 44, 14, 'DRAWING NO.'], info.number, 5, true);
	field([136, 14, 16, 10, 'REV'], info.revision, 4, true);
	field([152, 14, 28, 10, 'SHEET'], '1 OF 1', 3);
	field([136, 24, 44, 10, 'UNITS'], info.units === 'mm' ? 'MILLIMETRES' : 'INCHES', 2.8);
	s.rect(x0 + 136, y0 + 34, 44, 20, 'frame');
	s.text(`${info.projection.toUpperCase()} ANGLE PROJECTION`, [x0 + 137.2, y0 + 36.4], {
		h: 1.6,
		align: 'start'
	});
	projectionSymbol(s, [x0 + 158, y0 + 45.5], info.projection);

	// Revision history, at the frame's top-right corner.
	const rx = s.width - 10 - 120;
	const ry = 10;
	const columns: [string, number][] = [
		['REV', 14],
		['DESCRIPTION', 68],
		['DATE', 22],
		['BY', 16]
	];
	let cx = rx;
	for (const [name, w] of columns) {
		s.rect(cx, ry, w, 6, 'frame');
		s.rect(cx, ry + 6, w, 7, 'frame');
		s.text(name, [cx + w / 2, ry + 3], { h: 1.8 });
		cx += w;
	}
	const row = [info.revision, info.revisionNote, info.date, initials(info.drawnBy)];
	cx = rx;
	columns.forEach(([, w], i) => {
		s.text(row[i], [cx + w / 2, ry + 9.5], { h: 2.4 });
		cx += w;
	});
}

function initials(name: string) {
	return name
		.split(/[\s.]+/)
		.filter(Boolean)
		.map((part) => part[0].toUpperCase())
		.join('');
}

/** General notes, numbered, above the title block. Returns the y of each line's middle. */
export function drawNotes(s: Sheet, notes: string[], at: Pt) {
	s.text('NOTES', at, { h: 3, align: 'start', bold: true });
	return notes.map((note, i) => {
		const y = at[1] + 6 + i * 5;
		s.text(`${i + 1}.`, [at[0], y], { h: 2.6, align: 'start' });
		s.text(note, [at[0] + 5, y], { h: 2.6, align: 'start' });
		return y;
	});
}

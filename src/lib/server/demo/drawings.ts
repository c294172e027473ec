import { PDFDocument } from 'pdf-lib';
import { cachedFontkit, drawingFontFiles, parsedFont } from './fonts';
import type { DemoDrawing, DemoDrawingNumber, PartDrawing } from './parts/definition';
import { housing } from './parts/kf-1001-pump-housing';
import { driveShaft } from './parts/kf-1002-drive-shaft';
import { bushing } from './parts/kf-1003-bushing';
import { mountingBracket } from './parts/kf-2001-mounting-bracket';
import { Sheet, type Pt } from './sheet';
import { drawBorder, drawNotes, drawTitleBlock } from './title-block';

export type { DemoCallout } from './sheet';
export type { DemoDrawing, DemoDrawingNumber, GeneralTolerance } from './parts/definition';

/** One file per part drawing in ./parts. */
const definitions: PartDrawing[] = [housing, driveShaft, bushing, mountingBracket];

const sizes = { A3: [420, 297], A4: [297, 210] } as const;
const MM = 72 / 25.4;

function fontsFor(doc: PDFDocument) {
	const files = drawingFontFiles();
	doc.registerFontkit(cachedFontkit);
	const faces = { text: files.text, symbols: files.symbols, marks: files.marks };
	return Promise.all([
		doc.embedFont(files.text, { subset: true }),
		doc.embedFont(files.bold, { subset: true }),
		doc.embedFont(files.symbols, { subset: true }),
		doc.embedFont(files.marks, { subset: true })
	]).then(([text, bold, symbols, marks]) => ({
		text,
		bold,
		symbols,
		marks,
		has: (face: keyof typeof faces, codePoint: number) =>
			parsedFont(faces[face]).hasGlyphForCodePoint(codePoint)
	}));
}

function layout(definition: PartDrawing, sheet: Sheet, revision: string, date: string) {
	drawBorder(sheet);
	definition.draw(sheet);
	const height = sizes[definition.size][1];
	const notesAt: Pt = [28, height - 16 - 5 * definition.noteLines.length - 6];
	const ys = drawNotes(sheet, definition.noteLines, notesAt);
	definition.noteLines.forEach((line, i) => {
		sheet.record(line, [notesAt[0] + 5, ys[i]], 'note', 'General note');
	});
	drawTitleBlock(sheet, {
		number: definition.number,
		title: definition.title,
		partName: definition.partName,
		material: definition.material,
		units: definition.units,
		tolerancing: definition.tolerancing,
		scale: definition.scale,
		size: definition.size,
		projection: definition.projection,
		revision,
		revisionNote: revision === 'A' ? 'FIRST ISSUE' : 'SEE CHANGE RECORD',
		date,
		drawnBy: definition.drawnBy
	});
}

function describe(definition: PartDrawing): DemoDrawing {
	const [w, h] = sizes[definition.size];
	const dry = new Sheet(w, h, null, null);
	layout(definition, dry, 'A', '');
	const { number, title, partName, material, units, standard, generalTolerance } = definition;
	return {
		number,
		title,
		partName,
		material,
		units,
		standard,
		generalTolerance,
		notes: definition.noteLines.map((line, i) => `${i + 1}. ${line}`).join('\n'),
		sheets: [{ width: round2(w * MM), height: round2(h * MM) }],
		callouts: dry.callouts
	};
}

function round2(n: number) {
	return Math.round(n * 100) / 100;
}

/** The four demo drawings of the Kestrel Fluidics pump, with every callout drawn on them. */
export const demoDrawings: DemoDrawing[] = definitions.map(describe);

export interface DemoPdfOptions {
	/** Revision letter in the title block (default A). */
	revision?: string;
	/** Issue date in the title block, ISO format (default 2026-11-16). */
	date?: string;
}

/** A vector PDF of a demo drawing: one sheet, real text in embedded, subset fonts. */
export async function demoDrawingPdf(
	number: DemoDrawingNumber,
	options: DemoPdfOptions = {}
): Promise<Uint8Array> {
	const definition = definitions.find((d) => d.number === number);
	if (!definition) throw new Error(`No demo drawing ${number}`);
	const { revision = 'A', date = '2026-11-16' } = options;
	const [w, h] = sizes[definition.size];
	const doc = await PDFDocument.create();
	const fixed = new Date('2026-11-16T09:00:00Z');
	doc.setTitle(`${definition.number} ${definition.title}`);
	doc.setAuthor('Kestrel Fluidics');
	doc.setSubject(`${definition.partName}, revision ${revision}`);
	doc.setCreator('Checkplate demo data');
	doc.setProducer('Checkplate');
	doc.setCreationDate(fixed);
	doc.setModificationDate(fixed);
	const fonts = await fontsFor(doc);
	const page = doc.addPage([w * MM, h * MM]);
	layout(definition, new Sheet(w, h, page, fonts), revision, date);
	return doc.save();
}

import { db } from '$lib/server/db';
import { requireExport } from '$lib/server/drawings';
import { csvFile, fitsCsv } from '$lib/server/exports';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const place = await requireExport(params);
	return csvFile(place, 'fits', await fitsCsv(db, place));
};

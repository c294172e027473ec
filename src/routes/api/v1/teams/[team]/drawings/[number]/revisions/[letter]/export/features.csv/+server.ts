import { db } from '$lib/server/db';
import { requireExport } from '$lib/server/drawings';
import { csvFile, featuresCsv } from '$lib/server/exports';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params }) => {
	const place = await requireExport(params);
	return csvFile(place, 'features', await featuresCsv(db, place));
};

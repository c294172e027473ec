import { can } from '$lib/server/capabilities';
import { db } from '$lib/server/db';
import { isVisibleToSuppliers } from '$lib/server/db/queries/drawings';
import { openFindingsByFeature } from '$lib/server/db/queries/findings';
import { isFrozen } from '$lib/server/db/schema';
import { requireRevision } from '$lib/server/drawings';
import { featuresOf } from '$lib/server/features';
import { fitsOf } from '$lib/server/fits';
import type { FitAnswer } from '$lib/fits';
import { featureTableRow } from '$lib/tables';
import type { PageServerLoad } from './$types';

/** The revision's features and fits as tables, the CSV import and the exports. */
export const load: PageServerLoad = async ({ params }) => {
	const place = await requireRevision(params.team, params.number, params.letter, 'view');
	const { drawing, revision, membership } = place;
	const role = membership.role;
	const [features, fits, open] = await Promise.all([
		featuresOf(db, place),
		fitsOf(db, place),
		openFindingsByFeature(db, revision.id)
	]);
	return {
		drawing: { number: drawing.number, title: drawing.title },
		revision: { letter: revision.letter, state: revision.state },
		features: features.map((f) => ({ ...featureTableRow(f), openFindings: open.get(f.id) ?? 0 })),
		// The service's answer, which the integration tests check against the fitResponse schema.
		fits: fits as FitAnswer[],
		may: {
			edit: can(role, 'editFeatures') && !isFrozen(revision.state),
			export:
				can(role, 'exportUnreleased') ||
				(can(role, 'exportReleased') && isVisibleToSuppliers(revision.state))
		}
	};
};

import { can } from '$lib/server/capabilities';
import { requireMember } from '$lib/server/guards';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ params }) => {
	const { team, membership } = await requireMember(params.team, 'view');
	return {
		team: { id: team.id, slug: team.slug, name: team.name },
		role: membership.role,
		may: {
			manageTeam: can(membership.role, 'manageTeam'),
			viewUnreleased: can(membership.role, 'viewUnreleased'),
			author: can(membership.role, 'author')
		}
	};
};

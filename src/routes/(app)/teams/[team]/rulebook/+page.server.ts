import { fail } from '@sveltejs/kit';
import { capabilityGrade, severityOverrides } from '$lib/schemas/teams';
import { db } from '$lib/server/db';
import { updateTeamSettings } from '$lib/server/db/queries/teams';
import { requireMember } from '$lib/server/guards';
import { teamSettingsOf } from '$lib/server/teams';
import { CATALOGUE } from '$lib/tolerance/rulebook';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	const { team } = await requireMember(params.team, 'manageTeam');
	return {
		settings: teamSettingsOf(team),
		rules: CATALOGUE.map((r) => ({
			code: r.code,
			title: r.title,
			defaults: r.severities
				? [...new Set(r.severities.map((s) => s.severity))].join(' / ')
				: r.severity
		}))
	};
};

export const actions: Actions = {
	/** Severities per rule (`severity-LIM-01`: empty keeps the default) and the capability grade. */
	save: async ({ params, request }) => {
		const { user, team } = await requireMember(params.team, 'manageTeam');
		const form = Object.fromEntries(await request.formData()) as Record<string, string>;
		const chosen: Record<string, string> = {};
		for (const [k, v] of Object.entries(form)) {
			const code = /^severity-(.+)$/.exec(k)?.[1];
			if (code && v) chosen[code] = v;
		}
		const severities = severityOverrides.safeParse(chosen);
		const grade = capabilityGrade.safeParse(form.capabilityGrade || null);
		if (!severities.success || !grade.success) {
			const errors: Record<string, string[]> = {};
			if (!severities.success) errors.severities = [severities.error.issues[0].message];
			if (!grade.success) errors.capabilityGrade = [grade.error.issues[0].message];
			return fail(400, { values: form, errors });
		}
		const saved = await updateTeamSettings(
			db,
			user,
			team.id,
			{ severityOverrides: severities.data, capabilityGrade: grade.data },
			Number(form.version)
		);
		if (!saved) {
			return fail(409, {
				values: form,
				errors: {},
				message: 'Someone changed the settings since you loaded them: yours were not saved.'
			});
		}
		return { notice: "Saved. The team's open revisions were checked again." };
	}
};

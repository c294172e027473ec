import { error } from '@sveltejs/kit';
import { CATALOGUE, ruleExplanation } from '$lib/tolerance/rulebook/catalogue';
import type { PageLoad } from './$types';

export const load: PageLoad = ({ params }) => {
	const rule = ruleExplanation(params.code);
	if (!rule) error(404, `There is no rule ${params.code} in the rulebook`);
	const at = CATALOGUE.indexOf(rule);
	return {
		rule,
		previous: at > 0 ? CATALOGUE[at - 1].code : null,
		next: at < CATALOGUE.length - 1 ? CATALOGUE[at + 1].code : null
	};
};

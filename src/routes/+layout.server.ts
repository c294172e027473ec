import { formatSettings, timeZoneCookie } from '$lib/format';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals, request, cookies }) => ({
	user: locals.user,
	format: formatSettings(request.headers.get('accept-language'), cookies.get(timeZoneCookie))
});

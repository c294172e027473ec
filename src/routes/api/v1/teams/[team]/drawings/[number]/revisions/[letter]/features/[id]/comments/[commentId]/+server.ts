import { commentRoutes } from '$lib/server/thread-routes';

export const { PATCH } = commentRoutes('feature');

import { threadRoutes } from '$lib/server/thread-routes';

export const { GET, POST } = threadRoutes('feature');

// See https://svelte.dev/docs/kit/types#app.d.ts
import type { CurrentUser } from '$lib/server/auth';

declare global {
	namespace App {
		interface Error {
			message: string;
			errorId?: string;
			code?: string;
			[detail: string]: unknown;
		}
		interface Locals {
			/** The signed-in user (session cookie or, on the API, a personal token). */
			user: CurrentUser | null;
		}
	}
}

export {};

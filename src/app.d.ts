// See https://svelte.dev/docs/kit/types#app.d.ts
import type { FormatSettings } from '$lib/format';
import type { CurrentUser } from '$lib/server/auth';

declare global {
	namespace App {
		interface Error {
			message: string;
			errorId?: string;
			code?: string;
			[detail: string]: unknown;
		}
		interface PageData {
			/** The locale and time zone dates and numbers are printed in (root layout). */
			format?: FormatSettings;
		}
		interface Locals {
			/** The signed-in user (session cookie or, on the API, a personal token). */
			user: CurrentUser | null;
			/** True when the user was named by a personal API token rather than a session. */
			viaApiToken: boolean;
		}
	}
}

export {};

import { page } from '$app/state';
import { defaultFormat, formatsFor, type Formats } from './format';

/**
 * The formatters for the person viewing the page (see `./format.ts`). Call it inside `$derived`
 * so a change of time zone re-prints: `const format = $derived(formats());`.
 */
export function formats(): Formats {
	return formatsFor(page.data.format ?? defaultFormat);
}

/**
 * The one way dates and numbers are printed: `Intl`, in the person's locale and time zone. The
 * root layout's server load picks both (`formatSettings`) and hands them to every page, so the
 * server and the browser print the same text; `src/lib/format.svelte.ts` reads them in components.
 */
export interface FormatSettings {
	/** A BCP 47 locale tag, from the browser's Accept-Language. */
	locale: string;
	/** An IANA time zone, from the `tz` cookie the browser sets (UTC until it has). */
	timeZone: string;
}

export const defaultFormat: FormatSettings = { locale: 'en-US', timeZone: 'UTC' };

/** The cookie in which the browser tells the server its time zone. */
export const timeZoneCookie = 'tz';

/** The first locale of an Accept-Language header that this runtime can format in. */
function negotiateLocale(acceptLanguage: string | null | undefined): string {
	const wanted = (acceptLanguage ?? '')
		.split(',')
		.map((part) => part.split(';')[0].trim())
		.filter((tag) => tag && tag !== '*');
	for (const tag of wanted) {
		try {
			const [supported] = Intl.DateTimeFormat.supportedLocalesOf(tag);
			if (supported) return supported;
		} catch {
			// not a well-formed language tag: try the next one
		}
	}
	return defaultFormat.locale;
}

function validTimeZone(zone: string | null | undefined): string | null {
	if (!zone) return null;
	try {
		new Intl.DateTimeFormat('en', { timeZone: zone });
		return zone; // as the browser named it, so it compares equal to the browser's own
	} catch {
		return null;
	}
}

export function formatSettings(
	acceptLanguage: string | null | undefined,
	timeZone: string | null | undefined
): FormatSettings {
	return {
		locale: negotiateLocale(acceptLanguage),
		timeZone: validTimeZone(timeZone) ?? defaultFormat.timeZone
	};
}

export interface Formats {
	/** A day: "Dec 2, 2026". An empty value prints "—". */
	date(at: Date | string | null | undefined): string;
	/** A moment: "Dec 2, 2026, 7:48 AM". An empty value prints "—". */
	dateTime(at: Date | string | null | undefined): string;
	/** A file size in MiB: two decimals below 1 MiB, one above ("0.03 MB", "12.4 MB"). */
	megabytes(bytes: number): string;
}

const cache = new Map<string, Formats>();

/**
 * Newer ICU (Chromium) puts a narrow no-break space before AM/PM where Node 20's ICU puts a
 * space: print a space on both, so a page reads the same whoever rendered it.
 */
const sameOnEveryRuntime = (text: string) => text.replace(/\u202f/g, ' ');

/** The formatters for one locale and time zone (made once, then reused). */
export function formatsFor({ locale, timeZone }: FormatSettings): Formats {
	const key = `${locale} ${timeZone}`;
	let formats = cache.get(key);
	if (formats) return formats;
	const day = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeZone });
	const moment = new Intl.DateTimeFormat(locale, {
		dateStyle: 'medium',
		timeStyle: 'short',
		timeZone
	});
	const size = (digits: number) =>
		new Intl.NumberFormat(locale, {
			style: 'unit',
			unit: 'megabyte',
			minimumFractionDigits: digits,
			maximumFractionDigits: digits
		});
	const [small, large] = [size(2), size(1)];
	const mebibyte = 1024 * 1024;
	formats = {
		date: (at) => (at ? sameOnEveryRuntime(day.format(new Date(at))) : '—'),
		dateTime: (at) => (at ? sameOnEveryRuntime(moment.format(new Date(at))) : '—'),
		megabytes: (bytes) => (bytes < mebibyte ? small : large).format(bytes / mebibyte)
	};
	cache.set(key, formats);
	return formats;
}

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultFormat, formatSettings, formatsFor } from '../../src/lib/format';

// 2026-12-02 07:48 UTC: late evening of 1 December in Los Angeles, afternoon in Tokyo.
const at = new Date('2026-12-02T07:48:00Z');

describe('formatSettings', () => {
	it('takes the first locale of Accept-Language that can be formatted', () => {
		expect(formatSettings('de-DE,de;q=0.9,en;q=0.8', undefined).locale).toBe('de-DE');
		expect(formatSettings('*, fr;q=0.5', undefined).locale).toBe('fr');
		expect(formatSettings('not a tag!!, en-GB', undefined).locale).toBe('en-GB');
		expect(formatSettings(null, undefined)).toEqual(defaultFormat);
	});

	it('keeps a valid time zone as named, and falls back to UTC', () => {
		expect(formatSettings(null, 'Europe/Berlin').timeZone).toBe('Europe/Berlin');
		expect(formatSettings(null, 'Mars/Olympus').timeZone).toBe('UTC');
		expect(formatSettings(null, '').timeZone).toBe('UTC');
	});

	it('never throws, whatever the header and cookie say', () => {
		fc.assert(
			fc.property(fc.string(), fc.option(fc.string()), (header, zone) => {
				const settings = formatSettings(header, zone);
				expect(Intl.DateTimeFormat.supportedLocalesOf(settings.locale)).toHaveLength(1);
				expect(() => formatsFor(settings).dateTime(at)).not.toThrow();
			}),
			{ numRuns: 2_000 }
		);
	});
});

describe('formatsFor', () => {
	it('prints days and moments in the locale and time zone given', () => {
		const us = formatsFor({ locale: 'en-US', timeZone: 'UTC' });
		expect(us.date(at)).toBe('Dec 2, 2026');
		expect(us.dateTime(at)).toBe('Dec 2, 2026, 7:48 AM');
		expect(us.dateTime(at.toISOString())).toBe('Dec 2, 2026, 7:48 AM');
		expect(formatsFor({ locale: 'en-US', timeZone: 'America/Los_Angeles' }).date(at)).toBe(
			'Dec 1, 2026'
		);
		const de = formatsFor({ locale: 'de-DE', timeZone: 'Asia/Tokyo' });
		expect(de.dateTime(at)).toBe('02.12.2026, 16:48');
		expect(us.date(null)).toBe('—');
	});

	it('prints sizes in MiB with the locale’s decimal mark', () => {
		const us = formatsFor(defaultFormat);
		expect(us.megabytes(31_457)).toBe('0.03 MB');
		expect(us.megabytes(13_000_000)).toBe('12.4 MB');
		expect(formatsFor({ locale: 'de-DE', timeZone: 'UTC' }).megabytes(13_000_000)).toBe('12,4 MB');
	});
});

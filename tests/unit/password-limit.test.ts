import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { newPassword, passwordMaxBytes } from '../../src/lib/schemas/auth';

// bcrypt uses only the first 72 bytes of the password it is given (recalled; the bcryptjs
// README says the same).
describe('a new password', () => {
	it('is accepted up to 72 bytes and refused past them, counting bytes, not characters', () => {
		expect(passwordMaxBytes).toBe(72);
		expect(newPassword.safeParse('pump housing bore '.padEnd(72, 'x')).success).toBe(true);
		expect(newPassword.safeParse('pump housing bore '.padEnd(73, 'x')).success).toBe(false);
		// 25 three-byte characters are 75 bytes though only 25 characters.
		const wide = 'Bohrung Ø18 H7 ' + '€'.repeat(20);
		expect(wide.length).toBeLessThan(72);
		expect(newPassword.safeParse(wide).success).toBe(false);
	});

	it('is refused exactly when its UTF-8 form is longer than 72 bytes', () => {
		fc.assert(
			fc.property(fc.string({ minLength: 10, maxLength: 80, unit: 'grapheme' }), (p) => {
				const bytes = new TextEncoder().encode(p).length;
				const ok = newPassword.safeParse(p).success;
				if (bytes > passwordMaxBytes) expect(ok).toBe(false);
				else if (new Set(p).size >= 4) expect(ok).toBe(true);
			})
		);
	});
});

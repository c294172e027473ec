import { z } from 'zod';

export const email = z
	.string({ error: 'Enter your e-mail address' })
	.trim()
	.toLowerCase()
	.pipe(z.email({ error: 'Enter a valid e-mail address' }));

/** bcrypt reads only the first 72 bytes of a password; a longer one would be cut silently. */
export const passwordMaxBytes = 72;

/**
 * Length over composition rules (NIST SP 800-63B §5.1.1.2): at least 10 characters, and not
 * one character repeated or the e-mail address itself; at most 72 bytes, all of which count.
 */
export const newPassword = z
	.string({ error: 'Choose a password' })
	.min(10, { error: 'Use at least 10 characters' })
	.refine((p) => new TextEncoder().encode(p).length <= passwordMaxBytes, {
		error: `Use at most ${passwordMaxBytes} bytes (about ${passwordMaxBytes} plain letters)`
	})
	.refine((p) => new Set(p).size >= 4, { error: 'Use a less repetitive password' });

export const signInInput = z.object({
	email,
	password: z.string().min(1, { error: 'Enter your password' }).max(200)
});

export const signInLinkInput = z.object({ email });

export const signUpInput = z
	.object({
		name: z.string().trim().min(1, { error: 'Enter your name' }).max(120),
		email,
		password: newPassword
	})
	.refine((v) => !v.password.toLowerCase().includes(v.email.split('@')[0]), {
		error: 'Do not use your e-mail address in the password',
		path: ['password']
	});

export const resetRequestInput = z.object({ email });

export const resetInput = z.object({
	token: z.string().min(20).max(200),
	password: newPassword
});

export const changePasswordInput = z.object({
	currentPassword: z.string().min(1, { error: 'Enter your current password' }).max(200),
	password: newPassword
});

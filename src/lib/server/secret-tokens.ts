import { createHash, randomBytes } from 'node:crypto';

/**
 * A secret for a link or a client (sign-in links, invitations, API tokens): 32 random bytes,
 * base64url, after an optional prefix. Only its hash is stored, so a leaked table holds no
 * usable secret.
 */
export function newSecretToken(prefix = '') {
	const token = prefix + randomBytes(32).toString('base64url');
	return { token, hash: hashSecretToken(token) };
}

/** What the database keeps of a secret token, and how a presented one is looked up. */
export const hashSecretToken = (token: string) => createHash('sha256').update(token).digest('hex');

import bcrypt from 'bcryptjs';
import { passwordMaxBytes } from '../schemas/auth';

const cost = 11;

/** New passwords are checked against the limit first (`newPassword`); this is the last guard. */
export function hashPassword(password: string) {
	if (Buffer.byteLength(password) > passwordMaxBytes) {
		throw new Error(`A password longer than ${passwordMaxBytes} bytes cannot be hashed whole`);
	}
	return bcrypt.hash(password, cost);
}

/** bcrypt's compare is constant-time in the hash; a missing hash still costs one compare. */
export async function verifyPassword(password: string, hash: string | null | undefined) {
	const against = hash ?? '$2b$11$C6UzMDM.H6dfI/f/IKxGhuHqh6M3uY1/hI7yq3cCzhFhVPvAjmsWS';
	const ok = await bcrypt.compare(password, against);
	return ok && hash != null;
}

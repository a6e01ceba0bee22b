// Password hashing with argon2id. Parameters from the OWASP Password Storage Cheat Sheet's first
// argon2id option: m = 19 MiB (19456 KiB), t = 2, p = 1.
import { hash, verify } from '@node-rs/argon2';

const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
	// @node-rs/argon2 defaults to argon2id; the PHC string records the parameters used.
	return hash(password, OPTIONS);
}

export async function verifyPassword(stored: string, password: string): Promise<boolean> {
	try {
		return await verify(stored, password);
	} catch {
		return false;
	}
}

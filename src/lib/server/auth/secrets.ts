// Random secrets for cookies, API tokens and reset links, and the hash under which each is
// stored. 20 random bytes = 160 bits, beyond guessing; base32 (lower case, no padding) keeps
// them URL- and header-safe. Only SHA-256 hex of a secret reaches the database.
import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding';

export function randomSecret(bytes = 20): string {
	const buffer = new Uint8Array(bytes);
	crypto.getRandomValues(buffer);
	return encodeBase32LowerCaseNoPadding(buffer);
}

export function hashSecret(secret: string): string {
	return encodeHexLowerCase(sha256(new TextEncoder().encode(secret)));
}

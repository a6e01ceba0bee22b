// Secrets in links (invitations, read-only share links): 32 random bytes (256 bits) through the
// accounts' secret helper, base32, stored only as their SHA-256.
import { hashSecret, randomSecret } from '../auth/secrets';

export const TOKEN_PATTERN = /^[a-z2-7]{52}$/;
export const newSecretToken = (): string => randomSecret(32);
export const hashSecretToken = (token: string): string => hashSecret(token);

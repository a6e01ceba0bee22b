import type { ParamMatcher } from '@sveltejs/kit';

// Invitation and share-link tokens: 52 base32 characters (256 bits), see
// $lib/server/sharing/secret-token.ts. Matchers also run in the browser, so no server import.
export const match: ParamMatcher = (param) => /^[a-z2-7]{52}$/.test(param);

import type { ParamMatcher } from '@sveltejs/kit';

// A revision number: a positive integer without leading zeros, small enough for INTEGER.
export const match: ParamMatcher = (param) => /^[1-9]\d{0,8}$/.test(param);

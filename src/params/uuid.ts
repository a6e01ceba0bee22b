import type { ParamMatcher } from '@sveltejs/kit';

// Any RFC 4122 layout; PostgreSQL would reject anything else with an error instead of a 404.
export const match: ParamMatcher = (param) => /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(param);

import { requireUser } from '$lib/server/auth/guard';
import type { LayoutServerLoad } from './$types';

// Every page in (app) is for signed-in people. Form actions repeat the check themselves:
// actions do not run layout loads.
export const load: LayoutServerLoad = ({ locals, url }) => {
	requireUser(locals, url);
	return {};
};

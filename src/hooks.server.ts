import { sequence } from '@sveltejs/kit/hooks';
import { themeHandle } from '$lib/server/theme';

export const handle = sequence(themeHandle);

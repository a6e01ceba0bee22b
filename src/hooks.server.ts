import { sequence } from '@sveltejs/kit/hooks';
import { themeHandle } from '$lib/server/theme';
import { authHandle } from '$lib/server/auth/handle';

export const handle = sequence(authHandle, themeHandle);

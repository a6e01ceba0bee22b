// use:enhance for identity forms: keep what was typed when the answer is an error (SvelteKit
// would clear the form), except passwords, which are emptied as on a full page load; and say
// when the form is busy so its button can show it.
import type { SubmitFunction } from '@sveltejs/kit';

export function keepValues(setBusy: (busy: boolean) => void): SubmitFunction {
	return () => {
		setBusy(true);
		return async ({ update, result, formElement }) => {
			await update({ reset: false });
			if (result.type === 'failure') {
				for (const input of formElement.querySelectorAll<HTMLInputElement>('input[type="password"]')) input.value = '';
			}
			setBusy(false);
		};
	};
}

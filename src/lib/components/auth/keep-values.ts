// use:enhance for identity forms: keep what was typed when the answer is an error (SvelteKit
// would clear the form), except passwords, which are always emptied as on a full page load; and say
// when the form is busy so its button can show it. `clearOnSuccess` empties a form that
// creates something (the next entry starts blank).
import type { SubmitFunction } from '@sveltejs/kit';

export function keepValues(setBusy: (busy: boolean) => void, { clearOnSuccess = false } = {}): SubmitFunction {
	return () => {
		setBusy(true);
		return async ({ update, result, formElement }) => {
			await update({ reset: clearOnSuccess && result.type === 'success' });
			// Passwords never linger in the page, whatever the answer was.
			for (const input of formElement.querySelectorAll<HTMLInputElement>('input[type="password"]')) input.value = '';
			setBusy(false);
		};
	};
}

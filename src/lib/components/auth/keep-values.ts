// use:enhance for identity forms: keep what was typed when the answer is an error (SvelteKit
// would clear the form), and say when the form is busy so its button can show it.
export function keepValues(setBusy: (busy: boolean) => void) {
	return () => {
		setBusy(true);
		return async ({ update }: { update: (o?: { reset?: boolean }) => Promise<void> }) => {
			await update({ reset: false });
			setBusy(false);
		};
	};
}

// The answer of one account form, as the sections receive it.
export interface SectionAnswer {
	values?: Record<string, string>;
	errors?: Record<string, string>;
	message?: string;
	created?: { name: string; token: string };
}

/** use:enhance that keeps typed values on error and tells the section when it is busy. */
export function keepValues(setBusy: (busy: boolean) => void) {
	return () => {
		setBusy(true);
		return async ({ update }: { update: (o?: { reset?: boolean }) => Promise<void> }) => {
			await update({ reset: false });
			setBusy(false);
		};
	};
}

// The answer of one account form, as the sections receive it.
export interface SectionAnswer {
	values?: Record<string, string>;
	errors?: Record<string, string>;
	message?: string;
	created?: { name: string; token: string };
}


// Form data → zod → either typed data or field errors plus the values to put back. Password
// fields are never sent back to the page.
import { fail } from '@sveltejs/kit';
import type { z } from 'zod';

export type FieldErrors = Record<string, string>;
export type FormResult<T> = { ok: true; data: T } | { ok: false; errors: FieldErrors; values: Record<string, string> };

export function readForm<S extends z.ZodType>(schema: S, form: FormData, secret: string[] = ['password', 'current', 'confirm']): FormResult<z.output<S>> {
	const raw: Record<string, string> = {};
	for (const [key, value] of form) if (typeof value === 'string') raw[key] = value;
	const result = schema.safeParse(raw);
	if (result.success) return { ok: true, data: result.data };
	const errors: FieldErrors = {};
	for (const issue of result.error.issues) {
		const field = String(issue.path[0] ?? 'form');
		errors[field] ??= issue.message;
	}
	const values = Object.fromEntries(Object.entries(raw).filter(([k]) => !secret.includes(k) && k.length < 40).map(([k, v]) => [k, v.slice(0, 300)]));
	return { ok: false, errors, values };
}

export interface FormState {
	values: Record<string, string>;
	errors: FieldErrors;
	message: string;
}

/** One shape for every failed form, so pages read `form.errors.x` without type gymnastics. */
export function failForm<E extends object = object>(status: number, state: Partial<FormState> & E) {
	return fail(status, { values: {}, errors: {}, message: '', ...state } as FormState & Omit<E, keyof FormState>);
}

export function formState<E extends object = object>(state: Partial<FormState> & E) {
	return { values: {}, errors: {}, message: '', ...state } as FormState & Omit<E, keyof FormState>;
}

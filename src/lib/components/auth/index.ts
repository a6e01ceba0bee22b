export { default as TextField } from './text-field.svelte';
export { default as FormNotice } from './form-notice.svelte';
export { default as UserMenu } from './user-menu.svelte';
export { keepValues } from './keep-values';

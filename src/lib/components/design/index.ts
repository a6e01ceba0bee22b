export { default as DesignAids } from './design-aids.svelte';

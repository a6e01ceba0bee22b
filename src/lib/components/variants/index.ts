export { default as VariantsSideBySide } from './variants-side-by-side.svelte';
export { default as VariantFigures } from './variant-figures.svelte';
export { default as LegendMark } from './legend-mark.svelte';
export { variantStyle } from './styles';
export type { VariantRow } from './types';

export { default as NetlistView } from './netlist-view.svelte';
export { LargeAnalysis } from './large-analysis.svelte';

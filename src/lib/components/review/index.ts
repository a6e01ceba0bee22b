export { default as ReviewPanel } from './review-panel.svelte';
export { default as AnchorMarker } from './anchor-marker.svelte';
export { default as NotificationBell } from './notification-bell.svelte';
export { default as ActivityFeed } from './activity-feed.svelte';
export { SheetReview, setReviewContext, getReviewContext } from './sheet-review.svelte';
export type { Anchor } from './types';

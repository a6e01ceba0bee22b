import type { RequestEvent } from '@sveltejs/kit';

/**
 * The client's address for rate limits and the audit log. Behind a proxy, set adapter-node's
 * ADDRESS_HEADER (e.g. X-Forwarded-For) and XFF_DEPTH so this is the client, not the proxy.
 */
export function clientAddress(event: Pick<RequestEvent, 'getClientAddress'>): string {
	try {
		return event.getClientAddress() || 'unknown';
	} catch {
		return 'unknown';
	}
}

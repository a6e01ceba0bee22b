// What the sharing verbs need to know about the request besides who is asking.
import type { RequestEvent } from '@sveltejs/kit';
import { clientAddress } from '../auth/client-address';
import { publicOrigin } from '../mail';
import type { Context } from './workspace-actions';

export function requestContext(event: Pick<RequestEvent, 'url' | 'locals' | 'getClientAddress'>): Context {
	return { origin: publicOrigin(event.url), ip: clientAddress(event), actorName: event.locals.user?.name ?? 'A Polewise user' };
}

import type { APIRoute } from 'astro';
import { getAuth } from '../../../server/auth';
import { clientAddress } from '../../../server/client-address';

/**
 * better-auth's routes. The client address (the socket's, or behind PLUMBLINE_TRUSTED_PROXIES the
 * forwarded one) is passed in our own header, replacing any value a client sent under that name, so
 * address-based throttling cannot be spoofed.
 */
export const ALL: APIRoute = async (ctx) => {
  const auth = await getAuth();
  const headers = new Headers(ctx.request.headers);
  headers.set('x-plumbline-client-ip', clientAddress(ctx.clientAddress, ctx.request.headers));
  const request = new Request(ctx.request, { headers });
  return auth.handler(request);
};

import type { APIRoute } from 'astro';
import { getAuth } from '../../../server/auth';

/**
 * better-auth's routes. The client address Astro saw is passed in our own header (any value a
 * client sent under that name is replaced), so address-based throttling cannot be spoofed.
 */
export const ALL: APIRoute = async (ctx) => {
  const auth = await getAuth();
  const headers = new Headers(ctx.request.headers);
  headers.set('x-plumbline-client-ip', ctx.clientAddress);
  const request = new Request(ctx.request, { headers });
  return auth.handler(request);
};

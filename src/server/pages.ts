/** Page-side authorization: the same permissions as the API, for server-rendered pages. */
import type { AstroGlobal } from 'astro';
import { requirePermission, type Actor, type Permission } from './authz';

/** The signed-in actor holding `permission`; otherwise the middleware renders 403. */
export function pageActor(astro: AstroGlobal, permission: Permission): Actor {
  return requirePermission(astro.locals, permission);
}

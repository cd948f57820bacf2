/** What the kit library's pages tell their islands about the person looking. */
import type { KitViewer } from '../../lib/kits/api-types';
import { can, type Actor } from '../authz';
import { listInstallations } from '../services/installations';
import { utcToday } from './kits';

export async function kitViewer(actor: Actor): Promise<KitViewer> {
  const canRequest = can(actor, 'loans:request');
  const installations = canRequest ? (await listInstallations(actor)).map((i) => ({ code: i.code, name: i.name })) : [];
  return {
    id: actor.id,
    canManageKits: can(actor, 'kits:manage'),
    canManageLoans: can(actor, 'loans:manage'),
    canRequest,
    scoped: actor.scoped,
    installations,
    today: utcToday(),
  };
}

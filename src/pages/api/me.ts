import { requireActor } from '../../server/authz';
import { GRANTS } from '../../server/authz';
import { endpoint, json } from '../../server/http';

export const GET = endpoint(async (ctx) => {
  const actor = requireActor(ctx.locals);
  return json({ ...actor, permissions: GRANTS[actor.role] });
});

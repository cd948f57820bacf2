import { getDb } from '../../../db/client';
import { baselineRunSchema } from '../../../lib/schemas/baselines';
import { installationByCode, requirePermission } from '../../../server/authz';
import { runRefit, runState } from '../../../server/baselines/run';
import { logActivity } from '../../../server/activity';
import { endpoint, json, readJson } from '../../../server/http';

/** Progress of the current or last portfolio run. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'bills:read');
  return json(runState());
});

/** Starts a refit of every baseline, or of one installation's (`{ installation }`). Answers 202. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'baselines:review');
  const body = await readJson(ctx, baselineRunSchema);
  const scope = body.installation ? { installationIds: [(await installationByCode(await getDb(), actor, body.installation)).id] } : ('all' as const);
  void runRefit(scope, `requested by ${actor.email}`);
  await logActivity({ action: 'baseline.refit', userId: actor.id, actor: actor.email, ip: ctx.clientAddress, details: { installation: body.installation ?? 'all' } });
  return json(runState(), { status: 202 });
});

import { acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE } from '../../../lib/baseline/acceptance';
import { acceptanceSettingSchema } from '../../../lib/schemas/baselines';
import { requirePermission } from '../../../server/authz';
import { runRefit } from '../../../server/baselines/run';
import { endpoint, json, readJson } from '../../../server/http';
import { getSetting, putSetting } from '../../../server/settings';

const KEY = 'baseline-acceptance';

/** Acceptance thresholds of baselines: `{ maxCvrmse (fraction), minPeriods, minDays }`. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'bills:read');
  return json({ ...(await getSetting(KEY, acceptanceThresholdsSchema, DEFAULT_ACCEPTANCE)), defaults: DEFAULT_ACCEPTANCE });
});

/** Changes them and re-judges every baseline (a refit runs). */
export const PUT = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'baselines:review');
  const value = await readJson(ctx, acceptanceSettingSchema);
  await putSetting(actor, KEY, value, ctx.clientAddress);
  void runRefit('all', `criteria changed by ${actor.email}`);
  return json(value);
});

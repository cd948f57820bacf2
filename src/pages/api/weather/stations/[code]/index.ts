import { stationCodeSchema } from '../../../../../lib/schemas/weather';
import { requirePermission } from '../../../../../server/authz';
import { endpoint, errors, json } from '../../../../../server/http';
import { stationDetail } from '../../../../../server/weather/stations';

/** A station with its temperature coverage per year, gaps and interpolated days. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  const code = stationCodeSchema.safeParse(ctx.params.code);
  if (!code.success) throw errors.notFound();
  return json(await stationDetail(actor, code.data));
});

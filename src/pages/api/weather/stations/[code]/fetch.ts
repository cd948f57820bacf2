import { fetchRangeSchema, stationCodeSchema } from '../../../../../lib/schemas/weather';
import { requirePermission } from '../../../../../server/authz';
import { endpoint, errors, json, readJson } from '../../../../../server/http';
import { fetchWeather } from '../../../../../server/weather/stations';

/** Body `{ start, end }`: fetch daily Tmax/Tmin for that range from the weather service. */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'weather:write');
  const code = stationCodeSchema.safeParse(ctx.params.code);
  if (!code.success) throw errors.notFound();
  return json(await fetchWeather(actor, code.data, await readJson(ctx, fetchRangeSchema), ctx.clientAddress), { status: 201 });
});

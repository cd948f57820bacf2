import { stationCodeSchema, weatherUploadSchema } from '../../../../../lib/schemas/weather';
import { requirePermission } from '../../../../../server/authz';
import { maxUploadBytes } from '../../../../../server/config';
import { endpoint, errors, json, parseWith } from '../../../../../server/http';
import { readUpload } from '../../../../../server/upload';
import { importWeatherFile } from '../../../../../server/weather/stations';

/** Multipart: `file` (daily-summaries CSV: STATION, DATE, TMAX, TMIN) and `units` (standard = °F, metric = °C). */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'weather:write');
  const code = stationCodeSchema.safeParse(ctx.params.code);
  if (!code.success) throw errors.notFound();
  const { form, file } = await readUpload(ctx, maxUploadBytes());
  const { units } = parseWith(weatherUploadSchema, { units: form.get('units') ?? undefined });
  const report = await importWeatherFile(actor, code.data, { name: file.name || 'weather.csv', bytes: new Uint8Array(await file.arrayBuffer()) }, units, ctx.clientAddress);
  return json(report, { status: 201 });
});

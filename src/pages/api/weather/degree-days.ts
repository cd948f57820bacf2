import { z } from 'zod';
import { degreeDayQuerySchema, stationCodeSchema } from '../../../lib/schemas/weather';
import { requirePermission } from '../../../server/authz';
import { endpoint, json, readQuery } from '../../../server/http';
import { degreeDaysForPeriod, monthlyDegreeDays } from '../../../server/weather/stations';

const monthlySchema = z.object({
  station: stationCodeSchema,
  year: z.coerce.number().int().min(1900).max(2100),
  base: z.coerce.number().min(-50).max(120).default(65),
  unit: z.enum(['F', 'C']).default('F'),
});

/**
 * `?station=&start=&end=&base=&unit=F|C`: HDD and CDD of a period (inclusive dates) and the
 * normal year at that base; or `?station=&year=&base=&unit=`: per month of a year.
 */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  if (ctx.url.searchParams.has('year')) return json(await monthlyDegreeDays(actor, readQuery(ctx, monthlySchema)));
  return json(await degreeDaysForPeriod(actor, readQuery(ctx, degreeDayQuerySchema)));
});

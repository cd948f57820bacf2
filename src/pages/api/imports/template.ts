import { requirePermission } from '../../../server/authz';
import { endpoint } from '../../../server/http';

/** A bill file template: the columns Plumbline reads, with two example rows. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'bills:read');
  const csv = [
    'meter,period_start,period_end,quantity,unit,cost,peak_kw,estimated',
    'ABC-1001-E,2026-01-03,2026-02-02,48210,kWh,5920.44,162.5,N',
    'ABC-1001-G,2026-01-03,2026-02-02,3120,therm,2874.10,,N',
    '',
  ].join('\r\n');
  return new Response(csv, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': 'attachment; filename="plumbline-bills-template.csv"' },
  });
});

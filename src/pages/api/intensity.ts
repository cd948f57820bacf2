import { sql } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, queryRows } from '../../db/client';
import type { ExportColumn } from '../../lib/export/columns';
import { installationCodeSchema } from '../../lib/schemas/inventory';
import { logActivity } from '../../server/activity';
import { can, installationByCode, requirePermission, scopeToInstallations } from '../../server/authz';
import { csvResponse, xlsxResponse } from '../../server/export';
import { endpoint, errors, json, readQuery } from '../../server/http';

interface Row {
  installation: string;
  number: string;
  name: string;
  use_type: string;
  area_ft2: number;
  window_start: string;
  window_end: string;
  site_eui: number | null;
  eui_normalized: number | null;
  eui_normalized_uncertainty: number | null;
  source_eui: number | null;
  ghg_kg_per_ft2: number | null;
  wui: number | null;
  cost_intensity: number | null;
  coverage: number | null;
}

const COLUMNS: ExportColumn<Row>[] = [
  { key: 'installation', header: 'Installation', type: 'text' },
  { key: 'number', header: 'Building', type: 'text' },
  { key: 'name', header: 'Name', type: 'text' },
  { key: 'use_type', header: 'Use type', type: 'text' },
  { key: 'area_ft2', header: 'Gross floor area (ft2)', type: 'number' },
  { key: 'window_start', header: 'From', type: 'date' },
  { key: 'window_end', header: 'To', type: 'date' },
  { key: 'site_eui', header: 'Site EUI (kBtu/ft2/yr)', type: 'number' },
  { key: 'eui_normalized', header: 'Weather-normalized EUI (kBtu/ft2/yr)', type: 'number' },
  { key: 'eui_normalized_uncertainty', header: 'Its standard uncertainty (kBtu/ft2/yr)', type: 'number' },
  { key: 'source_eui', header: 'Source EUI (kBtu/ft2/yr)', type: 'number' },
  { key: 'ghg_kg_per_ft2', header: 'GHG (kg CO2e/ft2/yr)', type: 'number' },
  { key: 'wui', header: 'WUI (gal/ft2/yr)', type: 'number' },
  { key: 'cost_intensity', header: 'Cost intensity ($/ft2/yr)', type: 'number' },
  { key: 'coverage', header: 'Share of the period covered by bills', type: 'number' },
];

/** Intensities per building over the last 12 complete months: JSON, or `?format=csv|xlsx`. */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'inventory:read');
  const q = readQuery(ctx, z.object({ installation: installationCodeSchema.optional(), format: z.enum(['json', 'csv', 'xlsx']).default('json') }));
  const db = await getDb();
  const inst = q.installation ? await installationByCode(db, actor, q.installation) : null;
  const scope = scopeToInstallations(actor, sql`b.installation_id`);
  const rows = await queryRows<Row>(
    db,
    sql`select i.code as installation, b.number, b.name, b.use_type, m.area_ft2, m.window_start::text, m.window_end::text, m.site_eui, m.eui_normalized,
               m.eui_normalized_uncertainty, m.source_eui, m.ghg_kg_per_ft2, m.wui, m.cost_intensity, m.coverage
          from building_metric m join building b on b.id = m.building_id join installation i on i.id = b.installation_id
         where true ${inst ? sql`and b.installation_id = ${inst.id}` : sql``} ${scope ? sql`and ${scope}` : sql``}
         order by i.code, b.number`,
  );
  if (q.format === 'json') return json({ items: rows });
  if (!can(actor, 'exports')) throw errors.forbidden('Your role may not export.');
  await logActivity({ action: `export.intensity-${q.format}`, userId: actor.id, actor: actor.email, ip: ctx.clientAddress, details: { rows: rows.length } });
  return q.format === 'csv' ? csvResponse('plumbline-intensity', COLUMNS, rows) : xlsxResponse('plumbline-intensity', 'Intensity', COLUMNS, rows, 'Site energy in kBtu (EIA heat contents), water in US gallons; 12 complete months; source energy with ASHRAE 105-2021 Table K-2 ratios by default; GHG with EPA GHG Emission Factors Hub 2025 by default.');
});

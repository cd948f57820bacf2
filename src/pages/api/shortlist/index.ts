import { USE_TYPE_LABELS, type UseType } from '../../../lib/domain';
import type { ExportColumn } from '../../../lib/export/columns';
import { shortlistQuerySchema } from '../../../lib/schemas/shortlist';
import { logActivity } from '../../../server/activity';
import { can, requirePermission } from '../../../server/authz';
import { shortlist, shortlistJson, type ShortlistItem } from '../../../server/benchmark/shortlist';
import { csvResponse, xlsxResponse } from '../../../server/export';
import { endpoint, errors, jsonBytes, readQuery } from '../../../server/http';

type ExportRow = Omit<ShortlistItem, 'breakdown' | 'flag' | 'commodities'> & { reasons: string; flagged: string; useTypeLabel: string };
const COLUMNS: ExportColumn<ExportRow>[] = [
  { key: 'rank', header: 'Rank', type: 'number' },
  { key: 'score', header: 'Score (0-100)', type: 'number' },
  { key: 'installationCode', header: 'Installation', type: 'text' },
  { key: 'buildingNumber', header: 'Building', type: 'text' },
  { key: 'name', header: 'Name', type: 'text' },
  { key: 'useTypeLabel', header: 'Use type', type: 'text' },
  { key: 'areaFt2', header: 'Gross floor area (ft2)', type: 'number' },
  { key: 'euiNormalized', header: 'Weather-normalized EUI (kBtu/ft2/yr)', type: 'number' },
  { key: 'siteEui', header: 'Site EUI, last 12 months (kBtu/ft2/yr)', type: 'number' },
  { key: 'peerMedian', header: 'Peer median EUI, CBECS 2018 (kBtu/ft2/yr)', type: 'number' },
  { key: 'peerActivity', header: 'Peer group (CBECS 2018)', type: 'text' },
  { key: 'excessKbtu', header: 'Excess over peer median (kBtu/yr)', type: 'number' },
  { key: 'excessCost', header: 'Cost of the excess ($/yr)', type: 'number' },
  { key: 'wui', header: 'WUI (gal/ft2/yr)', type: 'number' },
  { key: 'lastEvaluatedOn', header: 'Last evaluated', type: 'date' },
  { key: 'flagged', header: 'Flagged for a walkthrough', type: 'text' },
  { key: 'reasons', header: 'Why it ranks here', type: 'text' },
];

/**
 * The audit shortlist, best candidate first: `{ items: [...], total, weights, asOf }`.
 * `?format=csv|xlsx` downloads it; filters: installation, useType, commodity, minAreaFt2, maxAreaFt2.
 */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'shortlist:read');
  const q = readQuery(ctx, shortlistQuerySchema);
  if (q.format === 'json') return jsonBytes(await shortlistJson(actor, q));
  if (!can(actor, 'exports')) throw errors.forbidden('Your role may not export.');
  const all = await shortlist(actor, { ...q, limit: 20_000, offset: 0, explain: 20_000 });
  const rows: ExportRow[] = all.items.map(({ breakdown, flag, commodities: _c, ...r }) => ({
    ...r,
    useTypeLabel: USE_TYPE_LABELS[r.useType as UseType] ?? r.useType,
    flagged: flag ? flag.reason : '',
    reasons: breakdown?.explanation.join(' ') ?? '',
  }));
  await logActivity({ action: `export.shortlist-${q.format}`, userId: actor.id, actor: actor.email, ip: ctx.clientAddress, details: { rows: rows.length } });
  const name = `plumbline-shortlist-${all.asOf}`;
  return q.format === 'csv' ? csvResponse(name, COLUMNS, rows) : xlsxResponse(name, 'Shortlist', COLUMNS, rows, `Audit priority as of ${all.asOf}. Weights: ${JSON.stringify(all.weights)}. Peer medians: U.S. EIA CBECS 2018 Table C12.`);
});

import { toCsv } from '../../../../lib/export/to-csv';
import { logActivity } from '../../../../server/activity';
import { requirePermission } from '../../../../server/authz';
import { endpoint, uuidParam } from '../../../../server/http';
import { getImport } from '../../../../server/imports/service';
import type { ImportProblem } from '../../../../server/imports/analyze';

/** The problems of an import as a CSV report (spreadsheet-safe). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  const run = await getImport(actor, uuidParam(ctx, 'id'));
  const problems = (run.problems as ImportProblem[]).map((p) => ({ ...p, column: p.column ?? '' }));
  const csv = toCsv(
    [
      { key: 'row', header: 'line', type: 'number' },
      { key: 'column', header: 'column', type: 'text' },
      { key: 'severity', header: 'severity', type: 'text' },
      { key: 'code', header: 'code', type: 'text' },
      { key: 'message', header: 'message', type: 'text' },
    ],
    problems,
    { bom: true },
  );
  await logActivity({ action: 'export.import-report', userId: actor.id, actor: actor.email, entityType: 'import', entityId: run.id, installationId: run.installationId, ip: ctx.clientAddress });
  const base = run.fileName.replace(/\.[^.]+$/, '').replace(/[^A-Za-z0-9_.-]+/g, '_').slice(0, 60) || 'import';
  return new Response(csv, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${base}-problems.csv"`,
      'cache-control': 'no-store',
    },
  });
});

import { z } from 'zod';
import { installationCodeSchema } from '../../../lib/schemas/inventory';
import { importFieldsSchema } from '../../../lib/schemas/imports';
import { getDb } from '../../../db/client';
import { installationByCode, requirePermission } from '../../../server/authz';
import { maxUploadBytes } from '../../../server/config';
import { endpoint, errors, json, parseWith, readQuery } from '../../../server/http';
import { importBills } from '../../../server/imports/bills';
import { listImports } from '../../../server/imports/service';
import { readUpload } from '../../../server/upload';

const querySchema = z.object({
  installation: installationCodeSchema.optional(),
  all: z.enum(['0', '1']).optional(),
  limit: z.coerce.number().int().min(1).max(500).optional(),
});

export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  const q = readQuery(ctx, querySchema);
  const inst = q.installation ? await installationByCode(await getDb(), actor, q.installation) : null;
  return json({ items: await listImports(actor, { installationId: inst?.id, includeDryRuns: q.all === '1', limit: q.limit }) });
});

/**
 * Multipart fields: `file`, `installation` (code), `mapping` (JSON: field → header, or for Green
 * Button usage point → meter code), `dryRun` (`true`/`false`, default true), `progressKey` (optional).
 */
export const POST = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:import');
  const { form, file } = await readUpload(ctx, maxUploadBytes());
  const fields = parseWith(importFieldsSchema, {
    installation: form.get('installation') ?? undefined,
    mapping: form.get('mapping') ?? undefined,
    dryRun: form.get('dryRun') ?? undefined,
    progressKey: form.get('progressKey') ?? undefined,
  });
  const inst = await installationByCode(await getDb(), actor, fields.installation);
  const bytes = new Uint8Array(await file.arrayBuffer());
  const report = await importBills(
    actor,
    { installation: { id: inst.id, code: inst.code }, fileName: file.name || 'upload', bytes, mapping: fields.mapping, dryRun: fields.dryRun, progressKey: fields.progressKey },
    ctx.clientAddress,
  );
  if (report.failure) throw errors.unprocessable(report.failure.message, { reason: report.failure.reason, importId: report.id });
  return json(report, { status: report.dryRun ? 200 : 201 });
});

import { requirePermission } from '../../../../server/authz';
import { endpoint, uuidParam } from '../../../../server/http';
import { importOriginal } from '../../../../server/imports/service';

/** The file as uploaded, always as a download (never rendered). */
export const GET = endpoint(async (ctx) => {
  const actor = requirePermission(ctx.locals, 'bills:read');
  const { fileName, bytes } = await importOriginal(actor, uuidParam(ctx, 'id'));
  const safe = fileName.replace(/[^A-Za-z0-9_.-]+/g, '_').slice(0, 100) || 'import';
  return new Response(new Uint8Array(bytes), {
    headers: {
      'content-type': 'application/octet-stream',
      'content-disposition': `attachment; filename="${safe}"`,
      'cache-control': 'no-store',
    },
  });
});

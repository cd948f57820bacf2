/**
 * The two walkthrough report downloads: BuildingSync 2.7.0 XML and the printable PDF. Either is
 * allowed to whoever may read the walkthrough (`walkthroughs:read`, which auditors hold for their
 * own installations), found only inside the caller's installations (404 otherwise), and logged.
 */
import type { APIContext } from 'astro';
import { toBuildingSync, auditDate, type WalkthroughReport } from '../../lib/reports';
import { logActivity } from '../activity';
import { requirePermission } from '../authz';
import { errors, uuidParam } from '../http';
import { loadWalkthroughReport } from './load';
import { renderWalkthroughPdf } from './pdf';
import { readPhotoFile } from './photos';

export type ReportFormat = 'buildingsync' | 'pdf';

/** `walkthrough-BNP-3204-2026-10-06`: installation, building number and audit date. */
export function reportFileName(r: WalkthroughReport): string {
  const safe = (s: string) => s.replace(/[^A-Za-z0-9_.-]+/g, '_').slice(0, 40);
  return `walkthrough-${safe(r.building.installationCode)}-${safe(r.building.number)}-${auditDate(r)}`;
}

export async function walkthroughReportResponse(ctx: APIContext, format: ReportFormat): Promise<Response> {
  const actor = requirePermission(ctx.locals, 'walkthroughs:read');
  const loaded = await loadWalkthroughReport(actor, uuidParam(ctx, 'id'));
  if (!loaded) throw errors.notFound('No such walkthrough.');
  const { report } = loaded;
  const name = reportFileName(report);
  const body: Uint8Array =
    format === 'buildingsync'
      ? new TextEncoder().encode(toBuildingSync(report))
      : await renderWalkthroughPdf(report, { photo: (p) => readPhotoFile(loaded.photoFiles.get(p.id) ?? '', p.mime) });
  await logActivity({
    action: format === 'buildingsync' ? 'export.walkthrough-buildingsync' : 'export.walkthrough-pdf',
    userId: actor.id,
    actor: actor.email,
    entityType: 'walkthrough',
    entityId: report.walkthrough.id,
    installationId: loaded.installationId,
    ip: ctx.clientAddress,
    details: { building: `${report.building.installationCode} ${report.building.number}`, bytes: body.byteLength },
  });
  return new Response(new Uint8Array(body), {
    headers: {
      'content-type': format === 'buildingsync' ? 'application/xml; charset=utf-8' : 'application/pdf',
      'content-disposition': `attachment; filename="${name}${format === 'buildingsync' ? '-buildingsync.xml' : '.pdf'}"`,
      'content-length': String(body.byteLength),
      'cache-control': 'no-store',
    },
  });
}

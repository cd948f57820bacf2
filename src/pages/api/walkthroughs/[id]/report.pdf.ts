import { endpoint } from '../../../../server/http';
import { walkthroughReportResponse } from '../../../../server/reports/export';

/** The walkthrough report as a printable PDF (download). */
export const GET = endpoint((ctx) => walkthroughReportResponse(ctx, 'pdf'));

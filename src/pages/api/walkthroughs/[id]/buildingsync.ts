import { endpoint } from '../../../../server/http';
import { walkthroughReportResponse } from '../../../../server/reports/export';

/** The walkthrough as a BuildingSync 2.7.0 XML document (download). */
export const GET = endpoint((ctx) => walkthroughReportResponse(ctx, 'buildingsync'));

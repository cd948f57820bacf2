import { measureInputSchema } from '../../../../lib/savings/measure-input';
import { requireActor } from '../../../../server/authz';
import { endpoint, json, readJson, uuidParam } from '../../../../server/http';
import { saveMeasure } from '../../../../server/measures/service';
import { requireAny } from '../../../../server/walkthroughs/access';

/**
 * `{ title?, savings: [{ commodity, quantity, unit }], annualEnergyCostSavings, annualWaterCostSavings,
 * annualOmCostSavings, installedCost, incentives, lifeYears, energyEscalationPercent? }` → the
 * measure with its economics at the discount rate in force (and that rate). 409 once decided.
 */
export const PUT = endpoint(async (ctx) => {
  const actor = requireActor(ctx.locals);
  requireAny(actor, ['walkthroughs:field', 'measures:approve'], 'price findings as measures');
  return json(await saveMeasure(actor, uuidParam(ctx, 'id'), await readJson(ctx, measureInputSchema), ctx.clientAddress));
});

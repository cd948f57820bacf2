import { DISCOUNT_RATE_CEILING_PERCENT, DISCOUNT_RATE_FLOOR_PERCENT, DEFAULT_DISCOUNT_RATE_SETTING, discountRateSettingSchema } from '../../../lib/economics/discount-rate';
import { requireActor, requirePermission } from '../../../server/authz';
import { endpoint, errors, json, readJson } from '../../../server/http';
import { currentDiscountRate, mayEditDiscountRate, setDiscountRate } from '../../../server/measures/discount-rate';

/** The real discount rate in force: `{ realDiscountRatePercent, effectiveFrom, source, setAt }`, its bounds and the default. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx.locals, 'walkthroughs:read');
  return json({ ...(await currentDiscountRate()), bounds: { floorPercent: DISCOUNT_RATE_FLOOR_PERCENT, ceilingPercent: DISCOUNT_RATE_CEILING_PERCENT }, defaults: DEFAULT_DISCOUNT_RATE_SETTING });
});

/** `{ realDiscountRatePercent (3–10), effectiveFrom, source }` (administrators and regional managers). Measures keep the rate they were computed at until their figures are saved again. */
export const PUT = endpoint(async (ctx) => {
  const actor = requireActor(ctx.locals);
  if (!mayEditDiscountRate(actor)) throw errors.forbidden(`Your role (${actor.role}) may not change the discount rate.`);
  const value = await readJson(ctx, discountRateSettingSchema);
  return json(await setDiscountRate(actor, value, ctx.clientAddress));
});

/**
 * The real discount rate for measure economics: a dated setting (10 CFR 436.14, bounded 3 %–10 %),
 * edited by an administrator or a regional manager and stored in app_setting.
 */
import { DEFAULT_DISCOUNT_RATE_SETTING, discountRateSettingSchema, type DiscountRateSetting } from '../../lib/economics/discount-rate';
import { can, type Actor } from '../authz';
import { errors } from '../http';
import { getSetting, putSetting } from '../settings';
import type { RateUsed } from './view';

export const DISCOUNT_RATE_KEY = 'discount-rate';

/** The rate in force, with when it was set here (null: the built-in default). */
export async function currentDiscountRate(): Promise<RateUsed> {
  const { updatedAt, ...s } = await getSetting(DISCOUNT_RATE_KEY, discountRateSettingSchema, DEFAULT_DISCOUNT_RATE_SETTING);
  return { ...s, setAt: updatedAt ?? null };
}

export function mayEditDiscountRate(actor: Actor): boolean {
  return can(actor, 'settings:write') || can(actor, 'measures:approve');
}

export async function setDiscountRate(actor: Actor, value: DiscountRateSetting, ip = ''): Promise<RateUsed> {
  if (!mayEditDiscountRate(actor)) throw errors.forbidden(`Your role (${actor.role}) may not change the discount rate.`);
  await putSetting(actor, DISCOUNT_RATE_KEY, value, ip);
  return currentDiscountRate();
}

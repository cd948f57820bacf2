/**
 * The field work of the demo region: kits, loans, shortlist flags and walkthroughs (see
 * kits.ts, loans.ts, walkthroughs.ts). Its own random streams (`field:kits`, `field:ids`), so
 * it shifts nothing else in the scenario.
 */
import { demoUuid } from './field-ids';
import type { DemoField, DemoFlag } from './field-types';
import { demoKits } from './kits';
import { demoLoans } from './loans';
import { Rng } from './prng';
import { at, baysideDining, corriganHall, FieldBuildings, harwoodHallPlanned, MANAGER, operationsCenter, type FieldContext } from './walkthroughs';

export function generateFieldData(seed: number, ctx: FieldContext): DemoField {
  const ids = new Rng(seed, 'field:ids');
  const f = new FieldBuildings(ctx);
  const flag = (code: string, number: string, reason: string, flaggedDay: number, clearedDay: number | null): DemoFlag => ({
    id: demoUuid(ids), installationCode: code, buildingNumber: number, reason, flaggedBy: MANAGER, flaggedAt: at(flaggedDay, '15:00'),
    clearedBy: clearedDay === null ? null : MANAGER, clearedAt: clearedDay === null ? null : at(clearedDay, '17:30'),
  });
  const bayside = f.evaluatedDay(f.building('SBP', '2301'));
  const operations = f.evaluatedDay(f.building('BNP', '3204'));
  const flags = [
    flag('SBP', '2301', 'Water use far above the other dining facilities; possible leaks.', bayside - 30, bayside),
    flag('BNP', '3204', 'Electricity at night nearly as high as by day.', operations - 35, operations),
    flag('KSL', '415', 'Heating oil use about twice the peers; heating starts at 66 °F.', ctx.today - 6, null),
  ];
  const walkthroughs = [corriganHall(ids, ctx), baysideDining(ids, ctx, flags[0]!.id), operationsCenter(ids, ctx, flags[1]!.id), harwoodHallPlanned(ids, ctx, flags[2]!.id)];
  return { kits: demoKits(new Rng(seed, 'field:kits'), ctx.today), loans: demoLoans(ids, ctx.today, walkthroughs), flags, walkthroughs };
}

/**
 * BuildingSync 2.7.0 Measure elements and savings fields for a walkthrough's measures, in the
 * schema's sequence order (BuildingSync.xsd v2.7.0, MeasureType and MeasureSavingsAnalysis):
 * annual site energy savings in MMBtu, cost savings in whole dollars (xs:integer), savings by fuel
 * in the schema's units, water savings in gallons, O&M savings, incentives, simple payback and net
 * present value. SIR and AIRR have no element of their own: they go in UserDefinedFields.
 */
import type { Commodity } from '../domain';
import { technologyFor, FUEL_TYPE, IMPLEMENTATION_STATUS, resourceUnits } from './buildingsync-codes';
import { convertSavings } from './roll-up';
import type { ReportFinding, ReportMeasure, ReportSaving } from './walkthrough-report';
import { xmlText, xsDecimal, xsInteger } from './xml-values';

/** A node for fast-xml-parser's XMLBuilder: keys in schema order, attributes prefixed with `@_`. */
export type XmlNode = { [key: string]: XmlValue };
export type XmlValue = string | XmlNode | XmlNode[] | string[];

const KBTU_PER_MMBTU = 1000; // 1 MMBtu = 1,000 kBtu (definition)

/** AnnualSavingsByFuel per energy commodity, summed in the schema's units; water is left out. */
export function savingsByFuel(savings: readonly ReportSaving[]): XmlNode[] {
  const byFuel = new Map<string, { fuel: string; units: string; quantity: number }>();
  for (const s of savings) {
    if (s.commodity === 'water') continue;
    const u = resourceUnits(s.commodity, s.unit);
    if (!u) continue;
    const fuel = FUEL_TYPE[s.commodity as Exclude<Commodity, 'water'>];
    const key = `${fuel}|${u.units}`;
    const row = byFuel.get(key) ?? { fuel, units: u.units, quantity: 0 };
    row.quantity += s.quantity * u.factor;
    byFuel.set(key, row);
  }
  return [...byFuel.values()].map((r) => ({ EnergyResource: r.fuel, ResourceUnits: r.units, AnnualSavingsNativeUnits: xsDecimal(r.quantity, 3) }));
}

/** The savings fields shared by MeasureSavingsAnalysis and PackageOfMeasures, up to the cost fields. */
export function savingsFields(savings: readonly ReportSaving[], energyCostUsd: number, waterCostUsd: number): XmlNode {
  const { siteKbtu, waterGallons } = convertSavings(savings);
  const fuels = savingsByFuel(savings);
  const hasWater = savings.some((s) => s.commodity === 'water');
  const node: XmlNode = {};
  if (fuels.length > 0) node.AnnualSavingsSiteEnergy = xsDecimal(siteKbtu / KBTU_PER_MMBTU, 3);
  node.AnnualSavingsCost = xsInteger(energyCostUsd + waterCostUsd);
  if (fuels.length > 0) node.AnnualSavingsByFuels = { AnnualSavingsByFuel: fuels };
  if (hasWater) node.AnnualWaterSavings = xsDecimal(waterGallons, 1);
  if (hasWater || waterCostUsd !== 0) node.AnnualWaterCostSavings = xsDecimal(waterCostUsd, 2);
  return node;
}

export function userFields(fields: readonly [string, string | null][]): XmlNode | null {
  const rows = fields.filter((f): f is [string, string] => f[1] !== null).map(([name, value]) => ({ FieldName: name, FieldValue: xmlText(value) }));
  return rows.length > 0 ? { UserDefinedField: rows } : null;
}

function measureSavingsAnalysis(m: ReportMeasure): XmlNode {
  const e = m.economics;
  const node: XmlNode = savingsFields(m.savings, m.annualEnergyCostSavingsUsd, m.annualWaterCostSavingsUsd);
  if (m.annualOmCostSavingsUsd !== 0) node.OMCostAnnualSavings = xsDecimal(m.annualOmCostSavingsUsd, 2);
  if (m.incentivesUsd > 0) node.FundingFromIncentives = xsDecimal(m.incentivesUsd, 2);
  if (e?.sir != null) node.CostEffectivenessScreeningMethod = 'Savings to investment ratio';
  if (e?.simplePaybackYears != null) node.SimplePayback = xsDecimal(e.simplePaybackYears, 2);
  if (e?.netSavingsUsd != null) node.NetPresentValue = xsDecimal(e.netSavingsUsd, 2);
  return node;
}

/** One Measure element for a finding's measure, linked to the building. */
export function measureElement(id: string, buildingId: string, finding: ReportFinding, m: ReportMeasure): XmlNode {
  const tech = technologyFor(finding.category, `${m.title} ${finding.title}`);
  const e = m.economics;
  const description = [finding.description, finding.location ? `Location: ${finding.location}` : ''].filter(Boolean).join('\n');
  const node: XmlNode = { '@_ID': id };
  if (tech.system) node.SystemCategoryAffected = tech.system;
  node.LinkedPremises = { Building: { LinkedBuildingID: { '@_IDref': buildingId } } };
  node.TechnologyCategories = { TechnologyCategory: { [tech.category]: { MeasureName: tech.measureName } } };
  node.CustomMeasureName = xmlText(m.title);
  if (xmlText(description)) node.LongDescription = xmlText(description);
  node.MeasureSavingsAnalysis = measureSavingsAnalysis(m);
  node.UsefulLife = xsInteger(m.lifeYears);
  node.MeasureTotalFirstCost = xsDecimal(m.installedCostUsd, 2);
  node.Recommended = m.status === 'rejected' ? 'false' : 'true';
  if (m.implementedOn) node.EndDate = m.implementedOn;
  node.ImplementationStatus = IMPLEMENTATION_STATUS[m.status];
  const udf = userFields([
    ['Finding', finding.title],
    ['Savings-to-investment ratio (10 CFR 436.21)', e?.sir != null ? xsDecimal(e.sir, 3) : null],
    ['Adjusted internal rate of return, % (10 CFR 436.22)', e?.airrPercent != null ? xsDecimal(e.airrPercent, 2) : null],
    ['Present value of savings, $', e?.pvSavingsUsd != null ? xsDecimal(e.pvSavingsUsd, 2) : null],
    ['Real discount rate, %', e?.discountRatePercent != null ? xsDecimal(e.discountRatePercent, 2) : null],
    ['Discount rate effective from', e?.rateEffectiveFrom ?? null],
  ]);
  if (udf) node.UserDefinedFields = udf;
  return node;
}

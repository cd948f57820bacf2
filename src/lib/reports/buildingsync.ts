/**
 * A walkthrough report as a BuildingSync 2.7.0 document (U.S. DOE's open schema for building
 * audit data; namespace http://buildingsync.net/schemas/bedes-auc/2019, BuildingSync.xsd v2.7.0):
 *
 *   Facilities/Facility
 *     Sites/Site (the installation) / Buildings/Building: name, number, occupancy
 *       classification, gross floor area, year of construction
 *     Measures/Measure: one per measure (see buildingsync-measures.ts)
 *     Reports/Report: Scenarios (current building measured from utility bills, weather normalized,
 *       the CBECS 2018 peer median as a benchmark, the baselines as derived models, the package of
 *       measures), audit dates, ASHRAE Standard 211 "Level 1: Walk-through", the discount rate,
 *       the auditor
 *     Contacts/Contact: the auditor
 *
 * Only elements and enumerations of the schema are written, in its sequence order; the test in
 * tests/unit/reports validates the output against the official XSD.
 *
 * @example
 *   const xml = toBuildingSync(report); // '<?xml version="1.0" encoding="UTF-8"?>\n<BuildingSync ...'
 */
import { XMLBuilder } from 'fast-xml-parser';
import type { Commodity } from '../domain';
import { FUEL_TYPE, guideline14ModelType, OCCUPANCY_CLASSIFICATION, resourceUnits } from './buildingsync-codes';
import { measureElement, savingsFields, userFields, type XmlNode } from './buildingsync-measures';
import { rollUpMeasures } from './roll-up';
import { auditDate, reportMeasures, walkthroughReportSchema, type ReportBaseline, type WalkthroughReport, type WalkthroughReportInput } from './walkthrough-report';
import { xmlText, xsDecimal } from './xml-values';

export const BUILDINGSYNC_NAMESPACE = 'http://buildingsync.net/schemas/bedes-auc/2019';
export const BUILDINGSYNC_VERSION = '2.7.0';

const ID = {
  facility: 'Facility-1',
  site: 'Site-1',
  building: 'Building-1',
  report: 'Report-1',
  auditor: 'Contact-Auditor',
  current: 'Scenario-Current',
  normalized: 'Scenario-Normalized',
  benchmark: 'Scenario-Benchmark',
  package: 'Scenario-Package',
} as const;

const linkedBuilding = (): XmlNode => ({ Building: { LinkedBuildingID: { '@_IDref': ID.building } } });

function buildingElement(r: WalkthroughReport): XmlNode {
  const b = r.building;
  const node: XmlNode = { '@_ID': ID.building, PremisesName: xmlText(`${b.number} ${b.name}`) };
  const notes = xmlText([r.walkthrough.form.building.spaceUses, r.walkthrough.form.building.observedConditions].filter(Boolean).join('\n'));
  if (notes) node.PremisesNotes = notes;
  node.PremisesIdentifiers = {
    PremisesIdentifier: [{ IdentifierLabel: 'Custom', IdentifierCustomName: 'Building number', IdentifierValue: xmlText(b.number) }],
  };
  node.BuildingClassification = 'Commercial';
  node.OccupancyClassification = OCCUPANCY_CLASSIFICATION[b.useType];
  node.FloorAreas = { FloorArea: { FloorAreaType: 'Gross', FloorAreaValue: xsDecimal(b.grossAreaFt2, 1) } };
  if (b.yearBuilt !== null) node.YearOfConstruction = String(b.yearBuilt);
  return node;
}

function siteElement(r: WalkthroughReport): XmlNode {
  const node: XmlNode = { '@_ID': ID.site, PremisesName: xmlText(`${r.building.installationName} (${r.building.installationCode})`) };
  if (r.building.address && xmlText(r.building.address)) node.Address = { StreetAddressDetail: { Simplified: { StreetAddress: xmlText(r.building.address) } } };
  node.Buildings = { Building: buildingElement(r) };
  return node;
}

function totalsScenario(id: string, name: string, normalized: boolean, eui: number): XmlNode {
  const node: XmlNode = { '@_ID': id, ScenarioName: name };
  if (normalized) node.Normalization = 'Weather normalized';
  node.ScenarioType = { CurrentBuilding: { CalculationMethod: { Measured: { MeasuredEnergySource: { UtilityBills: {} } } } } };
  node.AllResourceTotals = { AllResourceTotal: { '@_ID': `${id}-Total`, SiteEnergyUseIntensity: xsDecimal(eui, 2) } };
  node.LinkedPremises = linkedBuilding();
  return node;
}

/** A baseline as a DerivedModel scenario, when its shape is a Guideline 14 model in a unit the schema names as is. */
function baselineScenario(b: ReportBaseline, index: number): XmlNode | null {
  const modelType = guideline14ModelType(b.shape, b.parameters);
  if (b.commodity === 'water' || !modelType || !b.periodStart || !b.periodEnd) return null;
  const units = resourceUnits(b.commodity, b.unit);
  if (!units || units.factor !== 1) return null;
  const fuel = FUEL_TYPE[b.commodity as Exclude<Commodity, 'water'>];
  const performance: XmlNode = {};
  if (b.r2 !== null) performance.RSquared = xsDecimal(Math.min(1, Math.max(0, b.r2)), 4);
  if (b.cvrmse !== null) performance.CVRMSE = xsDecimal(Math.max(0, b.cvrmse * 100), 2);
  return {
    '@_ID': `Scenario-Baseline-${index}`,
    ScenarioName: `Baseline: ${fuel}, ${modelType}`,
    Normalization: 'Weather normalized',
    ScenarioType: {
      DerivedModel: {
        '@_ID': `DerivedModel-${index}`,
        DerivedModelName: `${fuel} use per day against outdoor temperature (degree days)`,
        MeasuredScenarioID: { '@_IDref': ID.current },
        Models: {
          Model: {
            '@_ID': `Model-${index}`,
            StartTimestamp: `${b.periodStart}T00:00:00`,
            // The schema's end timestamp is exclusive; the baseline period's end date is inclusive.
            EndTimestamp: `${nextDay(b.periodEnd)}T00:00:00`,
            DerivedModelInputs: {
              IntervalFrequency: 'Month',
              ResponseVariable: { ResponseVariableName: fuel, ResponseVariableUnits: units.units, ResponseVariableEndUse: 'All end uses' },
              ExplanatoryVariables: { ExplanatoryVariable: { ExplanatoryVariableName: 'Drybulb Temperature', ExplanatoryVariableUnits: 'Fahrenheit, F' } },
            },
            DerivedModelCoefficients: { Guideline14Model: { ModelType: modelType } },
            DerivedModelPerformance: performance,
          },
        },
      },
    },
  };
}

function nextDay(iso: string): string {
  const t = Date.parse(`${iso}T00:00:00Z`) + 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

function scenarios(r: WalkthroughReport, measureIds: string[]): XmlNode[] {
  const out: XmlNode[] = [];
  const bm = r.benchmark;
  if (bm?.siteEui != null) out.push(totalsScenario(ID.current, `Current building, measured (utility bills ${bm.windowStart} to ${bm.windowEnd})`, false, bm.siteEui));
  else out.push({ '@_ID': ID.current, ScenarioName: 'Current building, measured (utility bills)', ScenarioType: { CurrentBuilding: { CalculationMethod: { Measured: { MeasuredEnergySource: { UtilityBills: {} } } } } }, LinkedPremises: linkedBuilding() });
  if (bm?.euiNormalized != null) out.push(totalsScenario(ID.normalized, 'Current building, weather normalized to the normal year', true, bm.euiNormalized));
  if (bm?.peerMedianEui != null) {
    out.push({
      '@_ID': ID.benchmark,
      ScenarioName: xmlText(`Peer median site EUI (kBtu/ft2): ${bm.peerGroup ?? 'CBECS 2018'}`),
      ScenarioType: { Benchmark: { BenchmarkType: { CBECS: {} }, BenchmarkYear: '2018', BenchmarkValue: xsDecimal(bm.peerMedianEui, 1), LinkedPremises: linkedBuilding() } },
    });
  }
  r.baselines.forEach((b, i) => {
    const s = baselineScenario(b, i + 1);
    if (s) out.push(s);
  });
  if (measureIds.length > 0) out.push(packageScenario(r, measureIds));
  return out;
}

function packageScenario(r: WalkthroughReport, measureIds: string[]): XmlNode {
  const t = rollUpMeasures(r);
  const included = reportMeasures(r).map((x) => x.measure).filter((m) => m.status !== 'rejected');
  const pkg: XmlNode = {
    '@_ID': 'PackageOfMeasures-1',
    ReferenceCase: { '@_IDref': ID.current },
    MeasureIDs: { MeasureID: measureIds.map((id) => ({ '@_IDref': id })) },
    ...savingsFields(included.flatMap((m) => m.savings), t.annualEnergyCostSavingsUsd, t.annualWaterCostSavingsUsd),
    PackageFirstCost: xsDecimal(t.installedCostUsd, 2),
  };
  if (t.annualOmCostSavingsUsd !== 0) pkg.OMCostAnnualSavings = xsDecimal(t.annualOmCostSavingsUsd, 2);
  if (t.incentivesUsd > 0) pkg.FundingFromIncentives = xsDecimal(t.incentivesUsd, 2);
  if (t.sir !== null) pkg.CostEffectivenessScreeningMethod = 'Savings to investment ratio';
  if (t.simplePaybackYears !== null) pkg.SimplePayback = xsDecimal(t.simplePaybackYears, 2);
  if (t.pvSavingsUsd !== null) pkg.NetPresentValue = xsDecimal(t.pvSavingsUsd - t.netInvestmentUsd, 2);
  const udf = userFields([['Savings-to-investment ratio (10 CFR 436.21)', t.sir !== null ? xsDecimal(t.sir, 3) : null]]);
  if (udf) pkg.UserDefinedFields = udf;
  return { '@_ID': ID.package, ScenarioName: 'Walkthrough measures (not rejected)', ScenarioType: { PackageOfMeasures: pkg } };
}

function reportElement(r: WalkthroughReport, measureIds: string[]): XmlNode {
  const dates: XmlNode[] = [{ Date: auditDate(r), DateType: 'Site Visit' }];
  if (r.walkthrough.completedOn) dates.push({ Date: r.walkthrough.completedOn, DateType: 'Completion' });
  const node: XmlNode = { '@_ID': ID.report, Scenarios: { Scenario: scenarios(r, measureIds) }, AuditDates: { AuditDate: dates } };
  // ASHRAE Standard 211: a walkthrough is a Level 1 audit.
  node.ASHRAEAuditLevel = 'Level 1: Walk-through';
  node.FacilityEvaluationAuditDefinition = { BasicOnsiteAudit: 'ASHRAE Level 1 Audit' };
  const rate = rollUpMeasures(r).discountRatePercent;
  if (rate !== null) node.DiscountRate = xsDecimal(rate, 2);
  if (r.walkthrough.auditor) node.AuditorContactID = { '@_IDref': ID.auditor };
  node.LinkedPremisesOrSystem = linkedBuilding();
  const first = reportMeasures(r).find((x) => x.measure.economics?.rateEffectiveFrom)?.measure.economics;
  const udf = userFields([
    ['Walkthrough', r.walkthrough.title || null],
    ['Walkthrough status', r.walkthrough.status],
    ['Discount rate effective from', rate !== null ? (first?.rateEffectiveFrom ?? null) : null],
    ['Discount rate source', rate !== null ? (first?.rateSource ?? null) : null],
  ]);
  if (udf) node.UserDefinedFields = udf;
  return node;
}

/**
 * The report as a BuildingSync 2.7.0 XML document (UTF-8 text).
 * @throws ZodError when the report does not match its schema (a caller's bug).
 */
export function toBuildingSync(input: WalkthroughReportInput): string {
  const r = walkthroughReportSchema.parse(input);
  const measures = reportMeasures(r);
  const measureIds = measures.map((_, i) => `Measure-${i + 1}`);
  const included = measureIds.filter((_, i) => measures[i]!.measure.status !== 'rejected');
  const facility: XmlNode = { '@_ID': ID.facility, Sites: { Site: siteElement(r) } };
  if (measures.length > 0) facility.Measures = { Measure: measures.map((x, i) => measureElement(measureIds[i]!, ID.building, x.finding, x.measure)) };
  facility.Reports = { Report: reportElement(r, included) };
  if (r.walkthrough.auditor) {
    facility.Contacts = {
      Contact: {
        '@_ID': ID.auditor,
        ContactRoles: { ContactRole: 'Energy Auditor' },
        ContactName: xmlText(r.walkthrough.auditor.name),
        ContactEmailAddresses: { ContactEmailAddress: { ContactEmailAddressLabel: 'Work', EmailAddress: xmlText(r.walkthrough.auditor.email) } },
      },
    };
  }
  const doc = {
    '?xml': { '@_version': '1.0', '@_encoding': 'UTF-8' },
    BuildingSync: { '@_xmlns': BUILDINGSYNC_NAMESPACE, '@_version': BUILDINGSYNC_VERSION, Facilities: { Facility: facility } },
  };
  const builder = new XMLBuilder({ ignoreAttributes: false, attributeNamePrefix: '@_', format: true, indentBy: '  ', suppressEmptyNode: true });
  return builder.build(doc) as string;
}

/**
 * The walkthrough report as BuildingSync 2.7.0: valid against the official schema, and the values
 * read back from the document are the report's, in the schema's units.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { XMLParser } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { validateXML } from 'xmllint-wasm';
import { toBuildingSync } from '../../../src/lib/reports';
import { fullReport, minimalReport } from './report-fixture';

// Source: BuildingSync.xsd v2.7.0 (U.S. DOE, github.com/BuildingSync/schema tag v2.7.0, BSD-style
// licence in tests/fixtures/schemas/buildingsync-2.7.0/LICENSE.md); its gbXML import points at the
// local stub (tests/fixtures/schemas/README.md).
const dir = fileURLToPath(new URL('../../fixtures/schemas/', import.meta.url));
const read = (name: string): string => readFileSync(`${dir}${name}`, 'utf8');
const XSD = read('buildingsync-2.7.0/BuildingSync.xsd');
const GBXML_STUB = read('gbxml-stub.xsd');

async function validate(xml: string) {
  return validateXML({
    xml: { fileName: 'report.xml', contents: xml },
    schema: { fileName: 'buildingsync-2.7.0/BuildingSync.xsd', contents: XSD },
    preload: [{ fileName: 'gbxml-stub.xsd', contents: GBXML_STUB }],
  });
}

const ARRAYS = new Set(['Measure', 'Scenario', 'AnnualSavingsByFuel', 'AuditDate', 'UserDefinedField', 'MeasureID']);
const parse = (xml: string) => new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@_', parseTagValue: false, isArray: (name) => ARRAYS.has(name) }).parse(xml);

// Source: U.S. EIA, "Units and calculators explained": 1 kWh = 3,412 Btu; 1 therm = 100,000 Btu;
// No. 2 fuel oil 138,500 Btu per gallon. Definitions: 1 kcf = 1,000 ft³ = 10 ccf; 1 kgal = 1,000 gal;
// 1 MMBtu = 1,000 kBtu.
const KBTU_PER_KWH = 3.412;
const KBTU_PER_THERM = 100;
const KBTU_PER_GAL_OIL2 = 138.5;

describe('BuildingSync 2.7.0 output against the official schema', () => {
  it('a full report (every form section, photos, measures on four commodities) validates', async () => {
    const xml = toBuildingSync(fullReport());
    const r = await validate(xml);
    expect(r.errors).toEqual([]);
    expect(r.valid).toBe(true);
  }, 60_000);

  it('a minimal report (no findings, empty form, no auditor, no benchmark) validates', async () => {
    const xml = toBuildingSync(minimalReport());
    const r = await validate(xml);
    expect(r.errors).toEqual([]);
    expect(r.valid).toBe(true);
  }, 60_000);

  it('the validator is not a rubber stamp: an audit level outside the enumeration fails', async () => {
    const xml = toBuildingSync(minimalReport());
    const broken = xml.replace('Level 1: Walk-through', 'Level 1: Walkthrough');
    expect(broken).not.toBe(xml);
    const r = await validate(broken);
    expect(r.valid).toBe(false);
    expect(r.errors.map((e) => e.message).join('\n')).toMatch(/ASHRAEAuditLevel/);
  }, 60_000);
});

describe('values read back from the document', () => {
  const report = fullReport();
  const doc = parse(toBuildingSync(report)).BuildingSync;
  const facility = doc.Facilities.Facility;
  const building = facility.Sites.Site.Buildings.Building;
  const measures: any[] = facility.Measures.Measure;
  const byName = (name: string) => measures.find((m) => m.CustomMeasureName === name)!;

  it('is version 2.7.0 in the BuildingSync namespace', () => {
    expect(doc['@_version']).toBe('2.7.0');
    expect(doc['@_xmlns']).toBe('http://buildingsync.net/schemas/bedes-auc/2019');
  });

  it('carries the building: gross floor area, year built, occupancy classification, number', () => {
    expect(Number(building.FloorAreas.FloorArea.FloorAreaValue)).toBe(52000);
    expect(building.FloorAreas.FloorArea.FloorAreaType).toBe('Gross');
    expect(building.YearOfConstruction).toBe('1986');
    expect(building.OccupancyClassification).toBe('Office');
    expect(building.PremisesIdentifiers.PremisesIdentifier.IdentifierValue).toBe('4711');
  });

  it('escapes text: markup in notes and descriptions comes back as the same characters', () => {
    expect(building.PremisesNotes).toContain('Lights on in empty wings <after hours> & "weekends"');
    expect(byName('LED retrofit with occupancy sensors').LongDescription).toContain('T12 lamps & magnetic ballasts <always on>');
  });

  it('electricity savings in kWh and site energy in MMBtu (3.412 kBtu/kWh)', () => {
    const m = byName('LED retrofit with occupancy sensors');
    const fuel = m.MeasureSavingsAnalysis.AnnualSavingsByFuels.AnnualSavingsByFuel[0];
    expect(fuel.EnergyResource).toBe('Electricity');
    expect(fuel.ResourceUnits).toBe('kWh');
    expect(Number(fuel.AnnualSavingsNativeUnits)).toBe(21500);
    expect(Number(m.MeasureSavingsAnalysis.AnnualSavingsSiteEnergy)).toBeCloseTo((21500 * KBTU_PER_KWH) / 1000, 3);
  });

  it('gas in ccf becomes kcf by volume (÷ 10); its site energy uses the meter heat content', () => {
    const m = byName('Replace boiler with condensing boiler');
    const fuel = m.MeasureSavingsAnalysis.AnnualSavingsByFuels.AnnualSavingsByFuel[0];
    expect(fuel.EnergyResource).toBe('Natural gas');
    expect(fuel.ResourceUnits).toBe('kcf');
    expect(Number(fuel.AnnualSavingsNativeUnits)).toBeCloseTo(520, 6);
    // 104.2 kBtu per ccf stated by the meter (constructed).
    expect(Number(m.MeasureSavingsAnalysis.AnnualSavingsSiteEnergy)).toBeCloseTo((5200 * 104.2) / 1000, 3);
    expect(m.ImplementationStatus).toBe('Completed');
    expect(m.EndDate).toBe('2025-05-01');
    expect(m.TechnologyCategories.TechnologyCategory.BoilerPlantImprovements.MeasureName).toBe('Replace boiler');
  });

  it('water in kgal becomes gallons (× 1,000); gas therms stay therms; costs and payback as defined', () => {
    const m = byName('Repair leaks and fit 0.5 gpm aerators');
    const a = m.MeasureSavingsAnalysis;
    expect(Number(a.AnnualWaterSavings)).toBeCloseTo(38500, 6);
    expect(Number(a.AnnualWaterCostSavings)).toBe(400);
    const fuel = a.AnnualSavingsByFuels.AnnualSavingsByFuel[0];
    expect([fuel.EnergyResource, fuel.ResourceUnits, Number(fuel.AnnualSavingsNativeUnits)]).toEqual(['Natural gas', 'therms', 60]);
    expect(Number(a.AnnualSavingsSiteEnergy)).toBeCloseTo((60 * KBTU_PER_THERM) / 1000, 6);
    // AnnualSavingsCost is utility-bill savings per year in whole dollars (xs:integer): 67 + 400.
    expect(a.AnnualSavingsCost).toBe('467');
    // Simple payback = investment ÷ annual savings (10 CFR 436.23): 600 / 467.
    expect(Number(a.SimplePayback)).toBeCloseTo(600 / 467, 2);
    expect(Number(m.MeasureTotalFirstCost)).toBe(600);
    expect(m.UsefulLife).toBe('10');
  });

  it('fuel oil No. 2 maps to "Fuel oil no 2" in gallons; negative O&M savings stay negative', () => {
    const m = byName('Tune oil burner');
    const fuel = m.MeasureSavingsAnalysis.AnnualSavingsByFuels.AnnualSavingsByFuel[0];
    expect([fuel.EnergyResource, fuel.ResourceUnits, Number(fuel.AnnualSavingsNativeUnits)]).toEqual(['Fuel oil no 2', 'Gallons', 300]);
    expect(Number(m.MeasureSavingsAnalysis.AnnualSavingsSiteEnergy)).toBeCloseTo((300 * KBTU_PER_GAL_OIL2) / 1000, 3);
    expect(Number(m.MeasureSavingsAnalysis.OMCostAnnualSavings)).toBe(-50);
  });

  it('incentives, SIR and the discount rate; a rejected measure is discarded and left out of the package', () => {
    const led = byName('LED retrofit with occupancy sensors');
    expect(Number(led.MeasureSavingsAnalysis.FundingFromIncentives)).toBe(2000);
    // (14,000 − 2,000) / (2,236 + 150) per 10 CFR 436.23.
    expect(Number(led.MeasureSavingsAnalysis.SimplePayback)).toBeCloseTo(12000 / 2386, 2);
    const fields = Object.fromEntries(led.UserDefinedFields.UserDefinedField.map((f: any) => [f.FieldName, f.FieldValue]));
    // NIST Handbook 135 uniform present value, UPV = [(1+d)^n − 1] / [d(1+d)^n] = 11.938 at d = 3 %,
    // n = 15 (the handbook's UPV tables give 11.94 [memory]); SIR = (2,236 + 150) × 11.938 / 12,000.
    expect(Number(fields['Savings-to-investment ratio (10 CFR 436.21)'])).toBeCloseTo((2386 * 11.938) / 12000, 2);
    const rejected = byName('Computer power management');
    expect(rejected.ImplementationStatus).toBe('Discarded');
    expect(rejected.Recommended).toBe('false');
    const report1 = facility.Reports.Report;
    const pkg = report1.Scenarios.Scenario.find((s: any) => s.ScenarioType.PackageOfMeasures).ScenarioType.PackageOfMeasures;
    expect(pkg.MeasureIDs.MeasureID).toHaveLength(4);
    expect(pkg.MeasureIDs.MeasureID.map((x: any) => x['@_IDref'])).not.toContain(rejected['@_ID']);
    // Package first cost: 14,000 + 95,000 + 600 + 800 (rejected 0 left out anyway).
    expect(Number(pkg.PackageFirstCost)).toBe(110400);
    expect(Number(report1.DiscountRate)).toBe(3);
  });

  it('the audit is ASHRAE Standard 211 Level 1 with its dates, auditor and baselines', () => {
    const rep = facility.Reports.Report;
    expect(rep.ASHRAEAuditLevel).toBe('Level 1: Walk-through');
    expect(rep.AuditDates.AuditDate.map((d: any) => [d.Date, d.DateType])).toEqual([['2026-10-06', 'Site Visit'], ['2026-10-06', 'Completion']]);
    const contact = facility.Contacts.Contact;
    expect(rep.AuditorContactID['@_IDref']).toBe(contact['@_ID']);
    expect(contact.ContactName).toBe('Ada Example');
    expect(contact.ContactRoles.ContactRole).toBe('Energy Auditor');
    const models = rep.Scenarios.Scenario.filter((s: any) => s.ScenarioType.DerivedModel).map((s: any) => s.ScenarioType.DerivedModel.Models.Model);
    // Electricity 3PC and gas-in-therms 4P are written; gas in ccf (no schema unit of that size) and the constant water model are not.
    expect(models.map((m: any) => m.DerivedModelCoefficients.Guideline14Model.ModelType)).toEqual(['3 parameter cooling change point model', '4 parameter change point model']);
    // CV(RMSE) is a percentage in the schema: 0.045 → 4.5.
    expect(Number(models[0].DerivedModelPerformance.CVRMSE)).toBeCloseTo(4.5, 6);
    expect(models[0].EndTimestamp).toBe('2025-11-01T00:00:00');
    const benchmark = rep.Scenarios.Scenario.find((s: any) => s.ScenarioType.Benchmark).ScenarioType.Benchmark;
    expect(Number(benchmark.BenchmarkValue)).toBe(53.5);
  });

  it('strips characters XML 1.0 forbids instead of writing an unreadable document', async () => {
    const r = fullReport();
    r.findings[0]!.measure!.title = 'LED\u0001 retrofit\u0008';
    const xml = toBuildingSync(r);
    expect(xml).not.toMatch(/[\u0001\u0008]/);
    expect((await validate(xml)).valid).toBe(true);
  }, 60_000);
});

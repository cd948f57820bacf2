/**
 * Published sources cited by the field calculators, written once. `confidence` records how the
 * text was known when the calculator was written (see SourceCitation).
 */
import type { SourceCitation } from './calculator';

export const DOE_MOTOR_FACT_SHEET: SourceCitation = {
  title: 'Determining Electric Motor Load and Efficiency (DOE/GO-10097-517)',
  publisher: 'U.S. Department of Energy, Motor Challenge',
  kind: 'government',
  confidence: 'secondary',
  detail: 'Eq. 1 input power, Eq. 2 input at rated load, Eq. 3 load; slip method with voltage correction',
};

export const DOE_ENERGY_SAVER_APPLIANCE_USE: SourceCitation = {
  title: 'Estimating Appliance and Home Electronic Energy Use',
  publisher: 'U.S. Department of Energy, Energy Saver',
  kind: 'government',
  confidence: 'secondary',
  detail: 'wattage × hours per day × days per year ÷ 1000 = kWh',
};

export const UCONN_ITAC_TRAINING: SourceCitation = {
  title: 'UConn ITAC training notes (Power and Energy; Pumps; Payback; Time Value of Money)',
  publisher: 'University of Connecticut Industrial Training and Assessment Center',
  kind: 'university',
  confidence: 'secondary',
};

export const CFR_41_102_74_180: SourceCitation = {
  title: '41 CFR 102-74.180, illumination levels in Federal facilities',
  publisher: 'U.S. General Services Administration (Federal Management Regulation)',
  kind: 'regulation',
  confidence: 'secondary',
  detail: 'levels measured 30 in above the floor unless stated; corridors and stairwells at the walking surface',
};

export const IES_HANDBOOK_CATEGORIES: SourceCitation = {
  title: 'IESNA Lighting Handbook, 8th/9th ed., illuminance categories A–G',
  publisher: 'Illuminating Engineering Society',
  kind: 'standards-body',
  confidence: 'secondary',
  detail: 'low–mid–high values; current practice is ANSI/IES RP series with age-weighted targets',
};

export const UFC_3_530_01: SourceCitation = {
  title: 'UFC 3-530-01 Interior and Exterior Lighting (22 Aug 2006)',
  publisher: 'U.S. Department of Defense',
  kind: 'government',
  confidence: 'secondary',
  detail: 'waiting areas 100 lx (10 fc) horizontal ±10 %',
};

export const CFR_10_430_32: SourceCitation = {
  title: '10 CFR 430.32(o)–(r), water use standards (EPAct 1992)',
  publisher: 'U.S. Department of Energy',
  kind: 'regulation',
  confidence: 'primary',
  detail: 'faucets 2.2 gpm at 60 psi; showerheads 2.5 gpm at 80 psi; water closets; urinals',
};

export const WATERSENSE_SPECIFICATIONS: SourceCitation = {
  title: 'EPA WaterSense specifications (showerheads 2.0 gpm; lavatory faucets 1.5 gpm; toilets 1.28 gpf; urinals 0.5 gpf)',
  publisher: 'U.S. Environmental Protection Agency',
  kind: 'government',
  confidence: 'secondary',
  detail: 'check the current specification versions',
};

export const WATERSENSE_AT_WORK: SourceCitation = {
  title: 'WaterSense at Work (Oct 2012), section 3 restroom fixtures',
  publisher: 'U.S. Environmental Protection Agency',
  kind: 'government',
  confidence: 'secondary',
  detail: 'Eq. 3-5 faucets, 3-7 showerheads; 0.5 gpm recommended for public restroom faucets (p. 75)',
};

export const IAPMO_GREEN_PLUMBING_L701: SourceCitation = {
  title: 'IAPMO Green Plumbing and Mechanical Code Supplement, L 701.2 baseline water use',
  publisher: 'IAPMO',
  kind: 'standards-body',
  confidence: 'secondary',
  detail: 'water use = flow × duration × occupants × daily uses; baseline durations and uses per day',
};

export const BAG_FILL_METHOD: SourceCitation = {
  title: 'Bag-fill flow test: gpm = 60 ÷ seconds × gallons',
  publisher: 'New Hampshire Department of Environmental Services; EPA WaterSense new-home checklist',
  kind: 'government',
  confidence: 'secondary',
};

export const BIMSCHV_1_SIEGERT: SourceCitation = {
  title: '1. BImSchV (Germany), Anlage 2 Nr. 3.4.1: flue-gas loss qA = (tA − tL)·(A/(21 − O2) + B)',
  publisher: 'Federal Republic of Germany (BGBl I 2010, 38, as amended 2020)',
  kind: 'regulation',
  confidence: 'primary',
  detail: 'loss relative to the net calorific value (Heizwert): LHV basis; O2 in dry flue gas',
};

export const DOE_STEAM_TIP_4: SourceCitation = {
  title: 'Steam Tip Sheet #4, Improve Your Boiler’s Combustion Efficiency (Jan 2006)',
  publisher: 'U.S. Department of Energy, Industrial Technologies Program',
  kind: 'government',
  confidence: 'secondary',
  detail: 'table "Combustion Efficiency for Natural Gas"; complete combustion, dry combustion air; gross (HHV) basis [memory]',
};

export const GANAPATHY_EXCESS_AIR: SourceCitation = {
  title: 'Excess air from O2: EA = K·O2/(21 − O2), K = 90 for natural gas (V. Ganapathy)',
  publisher: 'Handbook of Energy Engineering Calculations, p. 56',
  kind: 'handbook',
  confidence: 'secondary',
};

export const ANSI_Z21_CO_AIR_FREE: SourceCitation = {
  title: 'ANSI Z21 appliance standards: air-free CO limits (400 ppm vented heating, 200 ppm unvented and residential water heaters, 800 ppm unvented ovens)',
  publisher: 'ANSI / CSA Group, as quoted in trade press (HVAC Today)',
  kind: 'standards-body',
  confidence: 'secondary',
  detail: 'CO air-free = CO × 20.9 / (20.9 − O2)',
};

export const HYDRAULIC_INSTITUTE_WHP: SourceCitation = {
  title: 'Water horsepower WHP = Q·H·SG/3960 (Hydraulic Institute form); 2.31 ft of water per psi',
  publisher: 'Utah State University, Merkley & Allen, Sprinkle & Trickle Irrigation Lectures, Lecture 11',
  kind: 'university',
  confidence: 'secondary',
};

import type { CompanySettingsBody, ExtraBody, ProductBody } from '../../../shared/api/settings';
import { UK_DEFAULT_TAX_RATES } from '../../../shared/quote/tax';

/**
 * Settings a company starts with until the office changes them. Savings inputs: UK standard-year
 * heating degree days (base 15.5 °C) about 2,462 K·day and a condensing gas boiler about 0.85–0.90
 * seasonal efficiency (published UK figures); the fuel price is an invented round figure.
 */
export function defaultCompanySettings(
  companyName: string,
): Required<Omit<CompanySettingsBody, 'address'>> & { address: { line1: string; line2: string; town: string; postcode: string } } {
  return {
    companyName,
    address: { line1: 'Address not set yet (Settings)', line2: '', town: 'Town not set', postcode: 'n/a' },
    email: '',
    phone: '',
    taxNumber: '',
    terms: DEFAULT_TERMS,
    validityDays: 30,
    currency: 'GBP',
    locale: 'en-GB',
    degreeDays: 2462,
    fuelPriceMinorPerKwh: 6.5,
    heatingEfficiency: 0.85,
    wasteAllowance: 0.1,
    minOffcutMm: 500,
    rollCountMethod: 'packing',
    eavesMode: 'gap',
    hatchKitInsulationMm: 0,
    actualsRequired: [],
    labour: {
      baseM2PerHour: 12,
      crossM2PerHour: 15,
      hourlyRateMinor: 3200,
      hourlyCostMinor: 1900,
      crewSize: 2,
      minimumChargeMinor: 18000,
      roundUpMinutes: 15,
      taxClass: 'energy_saving',
    },
    extraRules: { pipeLaggingMPerTank: 3, walkwayBoardsPerTank: 3, boardLegsPerM2: 4, disposalPerJob: 1, eavesTrays: true },
  };
}

export const DEFAULT_TERMS = [
  'Prices include materials, labour and disposal of offcuts and packaging as listed.',
  'We will agree the install date with you once the quote is accepted.',
  'Please clear the loft before we arrive, or tell us which areas stay boarded.',
  'Payment is due within 14 days of the installation being completed.',
  'If we find something on the day that this quote could not foresee (damp, damaged wiring, pests), we will stop and talk to you before doing any extra work.',
].join('\n');

export const DEFAULT_TAX_RATES = UK_DEFAULT_TAX_RATES;

/** The demo company's invented catalogue (prices in pence, roughly what a UK installer might charge). */
export const DEMO_PRODUCTS: ProductBody[] = [
  {
    name: 'Mineral wool roll 100 mm, split 3 × 380 mm',
    supplierCode: 'MW100-S3',
    thicknessMm: 100,
    rollWidthMm: 1140,
    lanes: 3,
    rollLengthMm: 8300,
    coverageM2: 9.46,
    lambdaWmK: 0.044,
    unitPriceMinor: 2450,
    unitCostMinor: 1580,
    taxClass: 'energy_saving',
    roles: ['base', 'cross'],
  },
  {
    name: 'Mineral wool roll 150 mm, split 3 × 380 mm',
    supplierCode: 'MW150-S3',
    thicknessMm: 150,
    rollWidthMm: 1140,
    lanes: 3,
    rollLengthMm: 5500,
    coverageM2: 6.27,
    lambdaWmK: 0.044,
    unitPriceMinor: 2590,
    unitCostMinor: 1690,
    taxClass: 'energy_saving',
    roles: ['base', 'cross'],
  },
  {
    name: 'Mineral wool roll 170 mm, 1140 mm wide',
    supplierCode: 'MW170',
    thicknessMm: 170,
    rollWidthMm: 1140,
    lanes: 1,
    rollLengthMm: 5000,
    coverageM2: 5.7,
    lambdaWmK: 0.044,
    unitPriceMinor: 2690,
    unitCostMinor: 1750,
    taxClass: 'energy_saving',
    roles: ['cross'],
  },
  {
    name: 'Mineral wool roll 200 mm, 1140 mm wide',
    supplierCode: 'MW200',
    thicknessMm: 200,
    rollWidthMm: 1140,
    lanes: 1,
    rollLengthMm: 4200,
    coverageM2: 4.79,
    lambdaWmK: 0.044,
    unitPriceMinor: 2790,
    unitCostMinor: 1820,
    taxClass: 'energy_saving',
    roles: ['cross'],
  },
  {
    name: 'Glass wool roll 170 mm, lower conductivity, 1200 mm wide',
    supplierCode: 'GW170-HP',
    thicknessMm: 170,
    rollWidthMm: 1200,
    lanes: 1,
    rollLengthMm: 5000,
    coverageM2: 6,
    lambdaWmK: 0.037,
    unitPriceMinor: 3450,
    unitCostMinor: 2300,
    taxClass: 'energy_saving',
    roles: ['cross'],
  },
];

export const DEMO_EXTRAS: ExtraBody[] = [
  {
    kind: 'hatch_kit',
    name: 'Hatch insulation and draught-seal kit',
    unit: 'each',
    unitPriceMinor: 3900,
    unitCostMinor: 1800,
    minutesPerUnit: 30,
    taxClass: 'energy_saving',
  },
  {
    kind: 'tank_jacket',
    name: 'Cold water tank jacket',
    unit: 'each',
    unitPriceMinor: 2800,
    unitCostMinor: 1300,
    minutesPerUnit: 20,
    taxClass: 'energy_saving',
  },
  {
    kind: 'pipe_lagging',
    name: 'Pipe lagging, 15–22 mm pipe',
    unit: 'm',
    unitPriceMinor: 350,
    unitCostMinor: 120,
    minutesPerUnit: 4,
    taxClass: 'energy_saving',
  },
  {
    kind: 'downlight_cover',
    name: 'Fire-rated downlight cover',
    unit: 'each',
    unitPriceMinor: 950,
    unitCostMinor: 420,
    minutesPerUnit: 10,
    taxClass: 'standard',
  },
  { kind: 'eaves_tray', name: 'Eaves ventilation tray', unit: 'each', unitPriceMinor: 180, unitCostMinor: 60, minutesPerUnit: 3, taxClass: 'standard' },
  {
    kind: 'walkway_board',
    name: 'Walkway board, 1220 × 320 mm',
    unit: 'each',
    unitPriceMinor: 1450,
    unitCostMinor: 750,
    minutesPerUnit: 8,
    taxClass: 'standard',
  },
  { kind: 'board_leg', name: 'Board-raising leg', unit: 'each', unitPriceMinor: 160, unitCostMinor: 55, minutesPerUnit: 3, taxClass: 'standard' },
  {
    kind: 'disposal',
    name: 'Disposal of offcuts and packaging',
    unit: 'job',
    unitPriceMinor: 4500,
    unitCostMinor: 2500,
    minutesPerUnit: 0,
    taxClass: 'standard',
  },
];

import { describe, expect, it } from 'vitest';
import type { Extra, ExtraKind, Product } from '../../shared/api/settings';
import { buildQuoteLines, type QuoteBuildSettings, type SpaceForQuote } from '../../shared/quote/build-lines';
import { computeQuoteTotals } from '../../shared/quote/totals';
import { UK_DEFAULT_TAX_RATES } from '../../shared/quote/tax';
import { quoteCautions } from '../../shared/quote/cautions';

const product = (id: string, name: string, unitPriceMinor: number): Product => ({
  id,
  name,
  supplierCode: '',
  thicknessMm: 100,
  rollWidthMm: 1140,
  lanes: 1,
  rollLengthMm: 8000,
  coverageM2: 9.12,
  lambdaWmK: 0.044,
  unitPriceMinor,
  unitCostMinor: 0,
  taxClass: 'energy_saving',
  roles: ['base', 'cross'],
  active: true,
});
const extra = (kind: ExtraKind, unitPriceMinor: number, minutesPerUnit: number, taxClass: Extra['taxClass'], unit: Extra['unit'] = 'each'): Extra => ({
  id: kind,
  kind,
  name: kind,
  unit,
  unitPriceMinor,
  unitCostMinor: 0,
  minutesPerUnit,
  taxClass,
  active: true,
});

const CATALOGUE = {
  products: [product('p100', 'Wool roll 100 mm', 2150), product('p170', 'Wool roll 170 mm', 2600)],
  extras: [
    extra('hatch_kit', 3500, 20, 'energy_saving'),
    extra('tank_jacket', 2200, 15, 'energy_saving'),
    extra('pipe_lagging', 250, 5, 'energy_saving', 'm'),
    extra('walkway_board', 1200, 10, 'standard'),
    extra('downlight_cover', 900, 10, 'standard'),
    extra('eaves_tray', 120, 2, 'standard'),
    extra('board_leg', 150, 3, 'standard'),
    extra('disposal', 3500, 0, 'standard', 'job'),
  ],
};
const SETTINGS: QuoteBuildSettings = {
  rollCountMethod: 'packing',
  labour: {
    baseM2PerHour: 12,
    crossM2PerHour: 15,
    hourlyRateMinor: 3000,
    hourlyCostMinor: 1800,
    crewSize: 2,
    minimumChargeMinor: 15000,
    roundUpMinutes: 15,
    taxClass: 'energy_saving',
  },
  extraRules: { pipeLaggingMPerTank: 3, walkwayBoardsPerTank: 3, boardLegsPerM2: 4, disposalPerJob: 1, eavesTrays: true },
};
const MAIN: SpaceForQuote = {
  spaceName: 'Main loft',
  layers: [
    { role: 'base', productId: 'p100', areaM2: 40.5, rollsByPacking: 9, rollsByArea: 8 },
    { role: 'cross', productId: 'p170', areaM2: 42, rollsByPacking: 6, rollsByArea: 6 },
  ],
  exclusionCounts: { hatch: 1, tank: 1, downlight: 3 },
  // 2.4 m² of boards raised to insulate under; eaves ventilators: 2 × 8400 mm of eaves at 400 mm rafter centres → 21 + 21 = 42.
  raisedBoardedAreaM2: 2.4,
  eavesVentilators: 42,
};
const GARAGE: SpaceForQuote = {
  spaceName: 'Garage loft',
  layers: [{ role: 'base', productId: 'p100', areaM2: 10, rollsByPacking: 3, rollsByArea: 2 }],
  exclusionCounts: {},
  raisedBoardedAreaM2: 0,
  eavesVentilators: 0,
};

describe('building quote lines from takeoffs', () => {
  it('prices a two-space job to the penny (worked by hand)', () => {
    // Materials: 100 mm rolls 9 + 3 = 12 by packing (rule of thumb 8 + 2 = 10), 50.5 m² → 12 × 2150 = 25800
    //            170 mm rolls 6 (rule of thumb 6), 42 m² → 6 × 2600 = 15600
    // Extras: hatch kit 1 × 3500, tank jacket 1 × 2200, lagging 3 m × 250 = 750, walkway 3 × 1200 = 3600,
    //   covers 3 × 900 = 2700, eaves trays 16800 / 400 = 42 × 120 = 5040, legs ceil(2.4 × 4 = 9.6) = 10 × 150 = 1500,
    //   disposal 1 × 3500 → 22790
    // Fitting minutes: 20 + 15 + 3×5 + 3×10 + 3×10 + 42×2 + 10×3 = 224 min = 3.733 h → 3.75 h
    // Labour: base 50.5 / 12 = 4.208 h → 4.25 h; cross 42 / 15 = 2.8 h → 3.0 h; 11.0 h × 3000 = 33000 (above the 15000 minimum)
    // Net 25800 + 15600 + 22790 + 33000 = 97190
    // Tax on 1 Dec 2026: standard lines 3600 + 2700 + 5040 + 1500 + 3500 = 16340 at 20% = 3268; the rest 0%.
    const built = buildQuoteLines([MAIN, GARAGE], CATALOGUE, SETTINGS);
    expect(built.warnings).toEqual([]);
    const byKind = (k: string) => built.lines.filter((l) => l.kind === k);
    expect(byKind('material').map((l) => [l.productId, l.quantity, l.altQuantity])).toEqual([
      ['p100', 12, 10],
      ['p170', 6, 6],
    ]);
    expect(byKind('extra').map((l) => [l.extraKind, l.quantity])).toEqual([
      ['hatch_kit', 1],
      ['tank_jacket', 1],
      ['pipe_lagging', 3],
      ['walkway_board', 3],
      ['downlight_cover', 3],
      ['eaves_tray', 42],
      ['board_leg', 10],
      ['disposal', 1],
    ]);
    expect(byKind('labour').map((l) => l.quantity)).toEqual([4.25, 3, 3.75]);
    expect(byKind('charge')).toEqual([]);
    expect(built.personHours).toBe(11);
    expect(built.siteHours).toBe(5.5); // crew of 2
    const t = computeQuoteTotals(built.lines, UK_DEFAULT_TAX_RATES, '2026-12-01');
    expect(t.netMinor).toBe(97190);
    expect(t.taxMinor).toBe(3268);
    expect(t.grossMinor).toBe(100458);
  });

  it('adds board-raising legs only where boards are raised, and eaves trays only where ventilators are fitted', () => {
    // Boards left as they are and the eaves kept back by a gap: the takeoff gives 0 m² raised and 0 ventilators.
    const kept = buildQuoteLines([{ ...MAIN, raisedBoardedAreaM2: 0, eavesVentilators: 0 }], CATALOGUE, SETTINGS);
    const kinds = kept.lines.filter((l) => l.kind === 'extra').map((l) => l.extraKind);
    expect(kinds).not.toContain('board_leg');
    expect(kinds).not.toContain('eaves_tray');
    // 1.3 m² raised: ceil(1.3 × 4 = 5.2) = 6 legs; 7 ventilators as counted.
    const raised = buildQuoteLines([{ ...MAIN, raisedBoardedAreaM2: 1.3, eavesVentilators: 7 }], CATALOGUE, SETTINGS);
    const q = (k: string) => raised.lines.find((l) => l.extraKind === k)?.quantity;
    expect([q('board_leg'), q('eaves_tray')]).toEqual([6, 7]);
  });

  it('prices by the rule of thumb when the company chooses it, keeping the packing count beside', () => {
    const built = buildQuoteLines([MAIN, GARAGE], CATALOGUE, { ...SETTINGS, rollCountMethod: 'area' });
    const m = built.lines.filter((l) => l.kind === 'material');
    expect(m.map((l) => [l.quantity, l.altQuantity])).toEqual([
      [10, 12],
      [6, 6],
    ]);
  });

  it('tops a small job up to the minimum charge', () => {
    // 10 m² / 12 m²/h = 0.833 h → 1.0 h = 3000; minimum 15000 → top-up 12000; garage has no extras but disposal.
    const built = buildQuoteLines([GARAGE], CATALOGUE, { ...SETTINGS, extraRules: { ...SETTINGS.extraRules, disposalPerJob: 0 } });
    expect(built.lines.map((l) => [l.kind, l.quantity, l.unitPriceMinor])).toEqual([
      ['material', 3, 2150],
      ['labour', 1, 3000],
      ['charge', 1, 12000],
    ]);
  });

  it('warns instead of guessing when the catalogue lacks a product or an extra', () => {
    const built = buildQuoteLines(
      [{ ...MAIN, layers: [{ role: 'base', productId: 'gone', productName: 'Old roll', areaM2: 5, rollsByPacking: 1, rollsByArea: 1 }] }],
      { products: [], extras: [] },
      SETTINGS,
    );
    expect(built.warnings.join('\n')).toMatch(/Old roll is not in the catalogue/);
    expect(built.warnings.join('\n')).toMatch(/no active hatch kit/);
    expect(built.lines[0]).toMatchObject({ kind: 'material', unitPriceMinor: 0, quantity: 1 });
  });

  it('states the tank and downlight cautions only when the plan has them', () => {
    const withTank = quoteCautions(['tank', 'downlight']).cautions.join(' ');
    const plain = quoteCautions([]).cautions.join(' ');
    expect(withTank).toMatch(/beneath the cold water tank/);
    expect(withTank).toMatch(/fire-rated covers/);
    expect(plain).not.toMatch(/tank/);
    expect(plain).toMatch(/work at height/);
  });
});

import { createRequire } from 'node:module';
import { Product } from '../../db/models/product';
import { parseProductCatalogue, type TakeoffProduct } from '../../../shared/takeoff/products';
import type { TakeoffSettings } from '../../../shared/takeoff/settings';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { loadCompanySettings } from '../settings/settings.service';

const require = createRequire(import.meta.url);

let defaults: TakeoffProduct[] | null = null;
/** The generic catalogue in examples/products.json, for companies that have not set up theirs. */
export function defaultProducts(): TakeoffProduct[] {
  defaults ??= parseProductCatalogue(require('../../../examples/products.json'));
  return defaults;
}

export type TakeoffInputs = { products: TakeoffProduct[]; settings: Partial<TakeoffSettings>; catalogue: 'company' | 'default' };

/**
 * What the takeoff needs besides the plan, for one company: its active roll products (or the
 * example defaults when it has none) and its settings (degree days, fuel price, efficiency,
 * waste). The editor receives the same inputs, so its live takeoff equals the saved one.
 * `withPrices: false` zeroes prices, the fuel price included (installers never see them).
 */
export async function takeoffInputsFor(organisationId: string, opts: { withPrices: boolean }): Promise<TakeoffInputs> {
  const [settingsRow, rows] = await Promise.all([
    loadCompanySettings(organisationId),
    Product.findAll({ where: { organisationId }, order: [['name', 'ASC']] }),
  ]);
  let products: TakeoffProduct[] = [];
  let catalogue: TakeoffInputs['catalogue'] = 'company';
  try {
    // parseProductCatalogue reads the catalogue's own field names (lanes, coverageM2, lambdaWmK…).
    products = parseProductCatalogue(rows.map((r) => ({ ...r.get({ plain: true }), id: r.id })));
  } catch {
    products = [];
  }
  if (products.length === 0) {
    products = defaultProducts();
    catalogue = 'default';
  }
  if (!opts.withPrices) products = products.map((p) => ({ ...p, priceMinor: 0 }));
  const settings = takeoffSettingsOf(settingsRow);
  // The company's fuel price is a price too: without it the yearly saving reads in kWh only.
  if (!opts.withPrices) settings.fuelPriceMinorPerKwh = 0;
  return { products, settings, catalogue };
}

type SettingsForTakeoff = { wasteAllowance: number; degreeDays: number; fuelPriceMinorPerKwh: number; heatingEfficiency: number };

/** The company's settings as the takeoff reads them (the company keeps waste as a fraction; the takeoff reads a percentage). */
export function takeoffSettingsOf(settings: SettingsForTakeoff): Partial<TakeoffSettings> {
  return {
    wasteAllowancePct: settings.wasteAllowance * 100,
    degreeDays: settings.degreeDays,
    fuelPriceMinorPerKwh: settings.fuelPriceMinorPerKwh,
    heatingEfficiency: settings.heatingEfficiency,
  };
}

/** Whether a value stored beside a plan revision is a takeoff of the current format and schema (older or missing ones are not). */
export function isTakeoff(x: unknown): x is Takeoff {
  return readStoredTakeoff(x) !== null;
}

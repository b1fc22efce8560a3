import type { Extra, ExtraRules, LabourSettings, Product } from '../api/settings';
import { extrasFor, type SpaceForExtras } from './extras';
import { multiplyMinor } from './money';
import type { QuoteLineInput } from './totals';

/** One insulation layer of one space, as the quote needs it from the takeoff. */
export interface LayerForQuote {
  role: 'base' | 'cross';
  productId: string;
  /** Shown when the product is not (or no longer) in the catalogue. */
  productName?: string;
  /** Net area the layer covers, m². */
  areaM2: number;
  /** Rolls from the roll plan (strips packed into rolls). */
  rollsByPacking: number;
  /** Rolls by the rule of thumb ceil(area × (1 + waste) / coverage) — common practice. */
  rollsByArea: number;
}

/** What the quote takes from one space's takeoff (the extras part is read by `extrasFor`). */
export interface SpaceForQuote extends SpaceForExtras {
  spaceName: string;
  layers: LayerForQuote[];
  yearlySaving?: { kwh: number; minor: number } | null;
}

export interface QuoteBuildSettings {
  rollCountMethod: 'packing' | 'area';
  labour: LabourSettings;
  extraRules: ExtraRules;
}

export interface BuiltLines {
  lines: QuoteLineInput[];
  /** Person-hours of labour (after rounding up) and hours on site for the crew. */
  personHours: number;
  siteHours: number;
  /** Things the office should look at: missing catalogue entries, products without a price. */
  warnings: string[];
}

const ROLE_TEXT: Record<LayerForQuote['role'], string> = {
  base: 'between the joists',
  cross: 'across the joists',
};

/** Rounds hours up to whole `minutes`; exact for the usual 15 minutes (0.25 h). */
function roundUpHours(hours: number, minutes: number): number {
  const steps = Math.ceil(Number(((hours * 60) / minutes).toFixed(9)));
  return Math.round(((steps * minutes) / 60) * 1000) / 1000;
}

function fmt(n: number, digits = 2): string {
  return n.toFixed(digits).replace(/\.?0+$/, '') || '0';
}

/**
 * Builds a draft quote's lines from the takeoffs of a job's spaces:
 * - one material line per product, summed over spaces and layers; quantity by the company's roll-count
 *   method (packing by default) with the other count beside it (`altQuantity`);
 * - extras from the exclusions and site checks: hatch kit per hatch, tank jacket, pipe lagging and
 *   walkway boards per tank, a cover per downlight, an eaves tray per rafter space along the eaves,
 *   board-raising legs for boarded areas, disposal once per job (the per-tank and per-m² counts are
 *   company settings — common practice, not a standard);
 * - labour per layer role at the company's m²/h, fitting time of the extras, each rounded up to the
 *   labour step, at the hourly rate; topped up to the minimum charge when below it.
 * Inactive catalogue items are skipped with a warning. Pure: same input, same lines.
 */
export function buildQuoteLines(
  spaces: readonly SpaceForQuote[],
  catalogue: { products: readonly Product[]; extras: readonly Extra[] },
  settings: QuoteBuildSettings,
  /** Rolls per product with the job's spaces pooled (`jobRollsByProduct`); else the spaces' own counts are added. */
  pooledRolls?: ReadonlyMap<string, number>,
): BuiltLines {
  const lines: QuoteLineInput[] = [];
  const warnings: string[] = [];

  // Materials, grouped by product in first-seen order.
  const byProduct = new Map<string, { layer: LayerForQuote; packing: number; area: number; areaM2: number; roles: Set<string> }>();
  const areaByRole = { base: 0, cross: 0 };
  for (const s of spaces) {
    for (const l of s.layers) {
      areaByRole[l.role] += l.areaM2;
      const g = byProduct.get(l.productId) ?? { layer: l, packing: 0, area: 0, areaM2: 0, roles: new Set<string>() };
      g.packing += l.rollsByPacking;
      g.area += l.rollsByArea;
      g.areaM2 += l.areaM2;
      g.roles.add(ROLE_TEXT[l.role]);
      byProduct.set(l.productId, g);
    }
  }
  for (const [productId, g] of byProduct) {
    const product = catalogue.products.find((p) => p.id === productId);
    const byPacking = settings.rollCountMethod === 'packing';
    const packing = pooledRolls?.get(productId) ?? g.packing;
    const quantity = byPacking ? packing : g.area;
    const alt = byPacking ? g.area : packing;
    const roles = [...g.roles].join(' and ');
    if (!product) warnings.push(`product ${g.layer.productName ?? productId} is not in the catalogue: set its price on the line`);
    else if (!product.active) warnings.push(`${product.name} is marked inactive in the catalogue`);
    lines.push({
      kind: 'material',
      description: `${product?.name ?? g.layer.productName ?? 'Insulation roll'} — ${roles}, ${fmt(g.areaM2)} m²`,
      quantity,
      unit: 'roll',
      unitPriceMinor: product?.unitPriceMinor ?? 0,
      unitCostMinor: product?.unitCostMinor ?? 0,
      taxClass: product?.taxClass ?? 'energy_saving',
      productId,
      altQuantity: alt,
      note: byPacking ? `rule of thumb: ${alt} rolls` : `by roll plan: ${alt} rolls`,
    });
  }

  // Extras, by the rule the van load uses too.
  let extraMinutes = 0;
  for (const { kind, quantity, why } of extrasFor(spaces, settings.extraRules)) {
    const extra = catalogue.extras.find((e) => e.kind === kind && e.active);
    if (!extra) {
      warnings.push(`no active ${kind.replace('_', ' ')} in the catalogue: ${quantity} needed (${why})`);
      continue;
    }
    extraMinutes += quantity * extra.minutesPerUnit;
    lines.push({
      kind: 'extra',
      description: extra.name,
      quantity,
      unit: extra.unit,
      unitPriceMinor: extra.unitPriceMinor,
      unitCostMinor: extra.unitCostMinor,
      taxClass: extra.taxClass,
      extraKind: kind,
      note: why,
    });
  }

  // Labour.
  const lab = settings.labour;
  let personHours = 0;
  let labourMinor = 0;
  const labourLine = (description: string, hours: number): void => {
    const q = roundUpHours(hours, lab.roundUpMinutes);
    personHours += q;
    labourMinor += multiplyMinor(q, lab.hourlyRateMinor);
    lines.push({
      kind: 'labour',
      description,
      quantity: q,
      unit: 'h',
      unitPriceMinor: lab.hourlyRateMinor,
      unitCostMinor: lab.hourlyCostMinor,
      taxClass: lab.taxClass,
    });
  };
  if (areaByRole.base > 0)
    labourLine(`Labour: lay base layer between the joists, ${fmt(areaByRole.base)} m² at ${fmt(lab.baseM2PerHour)} m²/h`, areaByRole.base / lab.baseM2PerHour);
  if (areaByRole.cross > 0)
    labourLine(
      `Labour: lay cross layer over the joists, ${fmt(areaByRole.cross)} m² at ${fmt(lab.crossM2PerHour)} m²/h`,
      areaByRole.cross / lab.crossM2PerHour,
    );
  if (extraMinutes > 0) labourLine('Labour: fit extras (kits, jackets, covers, trays, boards)', extraMinutes / 60);
  if (lab.minimumChargeMinor > 0 && labourMinor < lab.minimumChargeMinor && lines.length > 0) {
    lines.push({
      kind: 'charge',
      description: 'Minimum labour charge top-up',
      quantity: 1,
      unit: 'job',
      unitPriceMinor: lab.minimumChargeMinor - labourMinor,
      unitCostMinor: 0,
      taxClass: lab.taxClass,
      note: `labour is never charged below the minimum charge`,
    });
  }
  personHours = Math.round(personHours * 1000) / 1000;
  return { lines, personHours, siteHours: Math.round((personHours / lab.crewSize) * 100) / 100, warnings };
}

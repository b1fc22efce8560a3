import { z } from 'zod';

/** Layer roles a product may fill. */
export const LAYER_ROLES = ['base', 'cross'] as const;
/** `base` (between the joists) or `cross` (over them, at right angles). */
export type LayerRole = (typeof LAYER_ROLES)[number];

/**
 * A roll product as the takeoff reads it (the shape of `examples/products.json`).
 * Lengths mm, coverage m² per roll, conductivity W/mK, price minor units per roll.
 */
export const takeoffProductSchema = z.object({
  id: z.string().min(1).max(80),
  name: z.string().min(1).max(160),
  thicknessMm: z.number().positive().max(500),
  rollWidthMm: z.number().positive().max(3000),
  /** How many lanes the roll is split into (1 = not split). */
  lanesPerRoll: z.number().int().min(1).max(6),
  rollLengthMm: z.number().positive().max(50_000),
  coverageM2PerRoll: z.number().positive().max(100),
  lambda: z.number().min(0.015).max(0.1),
  priceMinor: z.number().int().min(0),
  /** Roles it may fill; both when absent. */
  roles: z.array(z.enum(LAYER_ROLES)).min(1).optional(),
});
/** A parsed roll product (see `takeoffProductSchema`). */
export type TakeoffProduct = z.infer<typeof takeoffProductSchema>;

/**
 * Reads a product catalogue: an array of products, or `{ products: [...] }`. Also accepts the
 * field names of the company catalogue API (`lanes`, `coverageM2`, `lambdaWmK`, `unitPriceMinor`,
 * inactive products skipped), so a saved catalogue can be passed straight in.
 * Throws a zod error naming the first bad field.
 */
export function parseProductCatalogue(input: unknown): TakeoffProduct[] {
  const list = Array.isArray(input) ? input : (input as { products?: unknown } | null)?.products;
  if (!Array.isArray(list)) throw new Error('a product catalogue is an array of products (or { "products": [...] })');
  return list
    .filter((p) => !(p && typeof p === 'object' && (p as { active?: unknown }).active === false))
    .map((raw) => {
      const p = (raw ?? {}) as Record<string, unknown>;
      return takeoffProductSchema.parse({
        ...p,
        lanesPerRoll: p.lanesPerRoll ?? p.lanes,
        coverageM2PerRoll: p.coverageM2PerRoll ?? p.coverageM2,
        lambda: p.lambda ?? p.lambdaWmK,
        priceMinor: p.priceMinor ?? p.unitPriceMinor,
        roles: p.roles,
      });
    });
}

/** Lane width of a product: roll width over lanes, mm. */
export function productLaneWidthMm(p: TakeoffProduct): number {
  return p.rollWidthMm / p.lanesPerRoll;
}

/** Whether a product may fill a role (no `roles` means both). */
export function productFitsRole(p: TakeoffProduct, role: LayerRole): boolean {
  return !p.roles || p.roles.includes(role);
}

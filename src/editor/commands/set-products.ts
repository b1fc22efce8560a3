import { productChoiceSchema, type Plan } from '../../../shared/plan/plan-schema';
import type { z } from 'zod';
import { CommandError } from './command';

export type ProductChoice = z.infer<typeof productChoiceSchema>;

/** Chooses catalogue products for the base and cross layers (ids from the company catalogue). */
export function setProducts(plan: Plan, args: { products: ProductChoice | undefined }): Plan {
  if (!args.products) {
    const { products: _p, ...rest } = plan;
    return rest as Plan;
  }
  const parsed = productChoiceSchema.safeParse(args.products);
  if (!parsed.success) throw new CommandError('product choice: ' + parsed.error.issues[0]?.message);
  return { ...plan, products: parsed.data };
}

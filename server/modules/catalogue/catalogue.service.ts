import type { Model, ModelStatic } from 'sequelize';
import type { Extra as ExtraDto, Product as ProductDto, TaxRate as TaxRateDto } from '../../../shared/api/settings';
import { Extra } from '../../db/models/extra';
import { Product } from '../../db/models/product';
import { TaxRate } from '../../db/models/tax-rate';
import { ConflictError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';

export function toProductDto(p: Product): ProductDto {
  return {
    id: p.id,
    name: p.name,
    supplierCode: p.supplierCode,
    thicknessMm: p.thicknessMm,
    rollWidthMm: p.rollWidthMm,
    lanes: p.lanes,
    rollLengthMm: p.rollLengthMm,
    coverageM2: p.coverageM2,
    lambdaWmK: p.lambdaWmK,
    unitPriceMinor: p.unitPriceMinor,
    unitCostMinor: p.unitCostMinor,
    taxClass: p.taxClass,
    roles: p.roles,
    active: p.active,
  };
}
export function toExtraDto(e: Extra): ExtraDto {
  return {
    id: e.id,
    kind: e.kind,
    name: e.name,
    unit: e.unit,
    unitPriceMinor: e.unitPriceMinor,
    unitCostMinor: e.unitCostMinor,
    minutesPerUnit: e.minutesPerUnit,
    taxClass: e.taxClass,
    active: e.active,
  };
}
export function toTaxRateDto(t: TaxRate): TaxRateDto {
  return { id: t.id, taxClass: t.taxClass, rateBp: t.rateBp, validFrom: t.validFrom, label: t.label };
}

/** The company's whole catalogue, as plain objects (used by the quote builder too). */
export async function loadCatalogue(organisationId: string) {
  const [products, extras, taxRates] = await Promise.all([
    Product.findAll({ where: { organisationId }, order: [['name', 'ASC']] }),
    Extra.findAll({
      where: { organisationId },
      order: [
        ['kind', 'ASC'],
        ['name', 'ASC'],
      ],
    }),
    TaxRate.findAll({
      where: { organisationId },
      order: [
        ['taxClass', 'ASC'],
        ['validFrom', 'ASC'],
      ],
    }),
  ]);
  return { products: products.map(toProductDto), extras: extras.map(toExtraDto), taxRates: taxRates.map(toTaxRateDto) };
}

interface Resource<M extends Model, D> {
  model: ModelStatic<M>;
  what: string;
  toDto: (m: M) => D;
}

/** List / create / update / delete for one catalogue table, always scoped to the actor's company. */
function crud<M extends Model, D>({ model, what, toDto }: Resource<M, D>) {
  const find = async (actor: SessionUser, id: string) => {
    const row = await model.findOne({ where: { id, organisationId: actor.organisationId } as never });
    if (!row) throw new NotFoundError(what);
    return row;
  };
  const unique = (e: unknown) => {
    if ((e as { name?: string })?.name === 'SequelizeUniqueConstraintError') {
      throw new ConflictError(`a ${what} for that class and date exists already`, 'duplicate');
    }
    throw e;
  };
  return {
    async list(actor: SessionUser) {
      const rows = await model.findAll({ where: { organisationId: actor.organisationId } as never, order: [['createdAt', 'ASC']] });
      return rows.map(toDto);
    },
    async create(actor: SessionUser, body: object) {
      const row = await model.create({ ...body, organisationId: actor.organisationId } as never).catch(unique);
      return toDto(row as M);
    },
    async update(actor: SessionUser, id: string, body: object) {
      const row = await find(actor, id);
      await row.update(body as never).catch(unique);
      return toDto(row);
    },
    async remove(actor: SessionUser, id: string) {
      const row = await find(actor, id);
      await row.destroy();
    },
  };
}

/** One CRUD service per catalogue table, keyed by its path segment under /api/catalogue. */
export function createCatalogueService() {
  return {
    products: crud({ model: Product, what: 'product', toDto: toProductDto }),
    extras: crud({ model: Extra, what: 'extra', toDto: toExtraDto }),
    'tax-rates': crud({ model: TaxRate, what: 'tax rate', toDto: toTaxRateDto }),
  };
}
export type CatalogueService = ReturnType<typeof createCatalogueService>;

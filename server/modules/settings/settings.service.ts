import { fileTypeFromBuffer } from 'file-type';
import type { Transaction } from 'sequelize';
import type { CompanySettings, CompanySettingsBody } from '../../../shared/api/settings';
import { companySettingsBodySchema, extraBodySchema, productBodySchema } from '../../../shared/api/settings';
import { Organisation } from '../../db/models';
import { CompanySetting } from '../../db/models/company-setting';
import { Extra } from '../../db/models/extra';
import { Product } from '../../db/models/product';
import { TaxRate } from '../../db/models/tax-rate';
import { BadRequestError, NotFoundError } from '../../lib/errors';
import { assertImagePixels, MAX_IMAGE_PIXELS } from '../../lib/uploads';
import { StorageNotFoundError, type Storage } from '../../lib/storage';
import type { SessionUser } from '../../types';
import { DEFAULT_TAX_RATES, DEMO_EXTRAS, DEMO_PRODUCTS, defaultCompanySettings } from './settings.defaults';

export function toSettingsDto(s: CompanySetting): CompanySettings {
  return {
    companyName: s.companyName,
    address: { line1: s.address.line1, line2: s.address.line2 ?? '', town: s.address.town, postcode: s.address.postcode },
    email: s.email,
    phone: s.phone,
    taxNumber: s.taxNumber,
    terms: s.terms,
    validityDays: s.validityDays,
    currency: s.currency,
    locale: s.locale,
    degreeDays: s.degreeDays,
    fuelPriceMinorPerKwh: s.fuelPriceMinorPerKwh,
    heatingEfficiency: s.heatingEfficiency,
    wasteAllowance: s.wasteAllowance,
    minOffcutMm: s.minOffcutMm ?? 500,
    rollCountMethod: s.rollCountMethod,
    eavesMode: s.eavesMode ?? 'gap',
    hatchKitInsulationMm: s.hatchKitInsulationMm ?? 0,
    actualsRequired: s.actualsRequired ?? [],
    labour: s.labour,
    extraRules: s.extraRules,
    hasLogo: !!s.logoKey,
  };
}

/**
 * The company's settings, for reading: its row, or the defaults (not saved) when it has none yet.
 * Reads never write; the row is created with the company (`createCompanyDefaults`) or by the first
 * change (`ensureCompanySettings`).
 */
export async function loadCompanySettings(organisationId: string, transaction?: Transaction): Promise<CompanySetting> {
  const existing = await CompanySetting.findByPk(organisationId, { transaction });
  if (existing) return existing;
  const org = await Organisation.findByPk(organisationId, { transaction });
  if (!org) throw new NotFoundError('organisation');
  return CompanySetting.build({ organisationId, ...defaultCompanySettings(org.name) } as never);
}

/**
 * What a new company starts with: its settings row with defaults and the default dated tax rates,
 * so it can quote at once. Idempotent (INSERT … ON CONFLICT DO NOTHING, and the unique
 * (organisation, class, valid_from) index on tax rates), so two first writes at once are safe.
 */
export async function createCompanyDefaults(organisationId: string, companyName: string, transaction?: Transaction): Promise<void> {
  await CompanySetting.bulkCreate([{ organisationId, ...defaultCompanySettings(companyName) } as never], { ignoreDuplicates: true, transaction });
  if ((await TaxRate.count({ where: { organisationId }, transaction })) === 0) {
    await TaxRate.bulkCreate(
      DEFAULT_TAX_RATES.map((r) => ({ organisationId, taxClass: r.taxClass, rateBp: r.rateBp, validFrom: r.validFrom, label: r.label ?? '' })) as never,
      { ignoreDuplicates: true, transaction },
    );
  }
}

/** The company's saved settings row, created with the defaults first if it has none (for writes). */
export async function ensureCompanySettings(organisationId: string): Promise<CompanySetting> {
  const existing = await CompanySetting.findByPk(organisationId);
  if (existing) return existing;
  const org = await Organisation.findByPk(organisationId);
  if (!org) throw new NotFoundError('organisation');
  await createCompanyDefaults(organisationId, org.name);
  return (await CompanySetting.findByPk(organisationId))!;
}

/**
 * Gives a company the demo catalogue (products and extras with invented prices) when it has none.
 * Called by the demo seed; safe to call twice.
 */
export async function seedDemoCatalogue(organisationId: string, company?: Partial<CompanySettingsBody>): Promise<void> {
  const settings = await ensureCompanySettings(organisationId);
  // Company details only while they are still the defaults: an office's own edits are never overwritten.
  if (company && settings.address.line1 === defaultCompanySettings('').address.line1) {
    const merged = companySettingsBodySchema.parse({ ...toSettingsDto(settings), ...company });
    await settings.update(merged as never);
  }
  if ((await Product.count({ where: { organisationId } })) === 0) {
    await Product.bulkCreate(DEMO_PRODUCTS.map((p) => ({ organisationId, ...productBodySchema.parse(p) })) as never);
  }
  if ((await Extra.count({ where: { organisationId } })) === 0) {
    await Extra.bulkCreate(DEMO_EXTRAS.map((e) => ({ organisationId, ...extraBodySchema.parse(e) })) as never);
  }
}

const LOGO_TYPES: Record<string, string> = { 'image/png': 'png', 'image/jpeg': 'jpg' };

/** The logo's type judged by its bytes with file-type (as photos and plan underlays are); null unless PNG or JPEG. */
async function sniffImage(buf: Buffer): Promise<string | null> {
  const mime = (await fileTypeFromBuffer(buf))?.mime;
  return mime && mime in LOGO_TYPES ? mime : null;
}

export function createSettingsService(storage: Storage) {
  return {
    async get(actor: SessionUser) {
      return toSettingsDto(await loadCompanySettings(actor.organisationId));
    },
    async update(actor: SessionUser, body: CompanySettingsBody) {
      const row = await ensureCompanySettings(actor.organisationId);
      await row.update(body as never);
      return toSettingsDto(row);
    },
    /** PNG or JPEG only (checked by content, not by name), at most 1 MB; pdfkit draws both. */
    async setLogo(actor: SessionUser, file: { buffer: Buffer } | undefined) {
      if (!file) throw new BadRequestError('attach the logo as a PNG or JPEG file in the "logo" field', 'file_missing');
      const type = await sniffImage(file.buffer);
      if (!type) throw new BadRequestError('the logo must be a PNG or JPEG image', 'unsupported_type');
      // pdfkit decodes the logo into every quote and invoice PDF: a pixel bomb would stall them all.
      await assertImagePixels(file.buffer, MAX_IMAGE_PIXELS.logo, 'logo');
      const row = await ensureCompanySettings(actor.organisationId);
      const key = `${actor.organisationId}/logo/logo.${LOGO_TYPES[type]}`;
      await storage.put(key, file.buffer, { contentType: type });
      await row.update({ logoKey: key, logoType: type });
      return toSettingsDto(row);
    },
    async removeLogo(actor: SessionUser) {
      const row = await ensureCompanySettings(actor.organisationId);
      if (row.logoKey) await storage.delete(row.logoKey);
      await row.update({ logoKey: null, logoType: null });
      return toSettingsDto(row);
    },
    async logo(actor: SessionUser) {
      const row = await loadCompanySettings(actor.organisationId);
      if (!row.logoKey) throw new NotFoundError('logo');
      try {
        return { type: row.logoType ?? 'application/octet-stream', body: await storage.get(row.logoKey) };
      } catch (e) {
        if (e instanceof StorageNotFoundError) throw new NotFoundError('logo');
        throw e;
      }
    },
  };
}
export type SettingsService = ReturnType<typeof createSettingsService>;

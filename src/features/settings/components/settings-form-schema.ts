import { z } from 'zod';
import { companySettingsBodySchema, extraRulesSchema, labourSettingsSchema, type CompanySettings } from '../../../../shared/api/settings';
import { formatMoneyInput } from '../../../../shared/quote/money-input';
import { booleanText, moneyText, numberText, percentText } from '../../../lib/forms';

const api = companySettingsBodySchema.shape;
const labour = labourSettingsSchema.shape;
const rules = extraRulesSchema.shape;
/** A settings number left blank is refused (naming the field), not silently put back to its default. */
const num = <T extends z.ZodType>(s: T) => numberText(s, { blank: 'missing' });

/**
 * The company settings form: the API's schema with each number read from the text typed, the waste
 * allowance typed as a percentage, and the labour money read in the currency typed on the same form.
 * Field paths are the API's, so the server's 422 lands on the same fields.
 */
export function settingsFormSchema(values: { currency: string }) {
  const currency = /^[A-Za-z]{3}$/.test(values.currency.trim()) ? values.currency.trim().toUpperCase() : 'GBP';
  return companySettingsBodySchema.extend({
    currency: z
      .string()
      .transform((s) => s.trim().toUpperCase())
      .pipe(api.currency),
    validityDays: num(api.validityDays),
    degreeDays: num(api.degreeDays),
    fuelPriceMinorPerKwh: num(api.fuelPriceMinorPerKwh),
    heatingEfficiency: num(api.heatingEfficiency),
    wasteAllowance: percentText(api.wasteAllowance, 'fraction'),
    minOffcutMm: num(api.minOffcutMm),
    hatchKitInsulationMm: num(api.hatchKitInsulationMm),
    labour: labourSettingsSchema.extend({
      baseM2PerHour: num(labour.baseM2PerHour),
      crossM2PerHour: num(labour.crossM2PerHour),
      hourlyRateMinor: moneyText(labour.hourlyRateMinor, currency),
      hourlyCostMinor: moneyText(labour.hourlyCostMinor, currency),
      crewSize: num(labour.crewSize),
      minimumChargeMinor: moneyText(labour.minimumChargeMinor, currency),
      roundUpMinutes: num(labour.roundUpMinutes),
    }),
    extraRules: extraRulesSchema.extend({
      pipeLaggingMPerTank: num(rules.pipeLaggingMPerTank),
      walkwayBoardsPerTank: num(rules.walkwayBoardsPerTank),
      boardLegsPerM2: num(rules.boardLegsPerM2),
      disposalPerJob: num(rules.disposalPerJob),
      eavesTrays: booleanText,
    }),
  });
}
export type SettingsFormValues = z.input<ReturnType<typeof settingsFormSchema>>;

/** The stored settings as the text the form shows (money as typed in the company's currency). */
export function settingsFormValues(s: CompanySettings): SettingsFormValues {
  const money = (x: number) => formatMoneyInput(x, s.currency);
  return {
    companyName: s.companyName,
    address: { line1: s.address.line1, line2: s.address.line2 ?? '', town: s.address.town, postcode: s.address.postcode },
    email: s.email,
    phone: s.phone,
    taxNumber: s.taxNumber,
    terms: s.terms,
    validityDays: String(s.validityDays),
    currency: s.currency,
    locale: s.locale,
    degreeDays: String(s.degreeDays),
    fuelPriceMinorPerKwh: String(s.fuelPriceMinorPerKwh),
    heatingEfficiency: String(s.heatingEfficiency),
    wasteAllowance: String(Math.round(s.wasteAllowance * 1000) / 10),
    minOffcutMm: String(s.minOffcutMm ?? 500),
    rollCountMethod: s.rollCountMethod,
    eavesMode: s.eavesMode ?? 'gap',
    hatchKitInsulationMm: String(s.hatchKitInsulationMm ?? 0),
    // Checkboxes on the pricing tab, sent back as stored from either tab: left out, the PUT would reset it to none.
    actualsRequired: s.actualsRequired ?? [],
    labour: {
      baseM2PerHour: String(s.labour.baseM2PerHour),
      crossM2PerHour: String(s.labour.crossM2PerHour),
      hourlyRateMinor: money(s.labour.hourlyRateMinor),
      hourlyCostMinor: money(s.labour.hourlyCostMinor),
      crewSize: String(s.labour.crewSize),
      minimumChargeMinor: money(s.labour.minimumChargeMinor),
      roundUpMinutes: String(s.labour.roundUpMinutes),
      taxClass: s.labour.taxClass,
    },
    extraRules: {
      pipeLaggingMPerTank: String(s.extraRules.pipeLaggingMPerTank),
      walkwayBoardsPerTank: String(s.extraRules.walkwayBoardsPerTank),
      boardLegsPerM2: String(s.extraRules.boardLegsPerM2),
      disposalPerJob: String(s.extraRules.disposalPerJob),
      eavesTrays: s.extraRules.eavesTrays ? 'true' : 'false',
    },
  };
}

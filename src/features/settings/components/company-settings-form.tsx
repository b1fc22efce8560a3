import { useState } from 'react';
import { companySettingsBodySchema, TAX_CLASS_LABELS, type CompanySettings } from '../../../../shared/api/settings';
import { minorToDecimalString } from '../../../../shared/quote/money';
import { parseMoney } from '../../../../shared/quote/money-input';
import { Alert, Button, Card, CardTitle, Field, Input, Select, Textarea } from '../../../components/ui';
import { serverFieldErrors } from '../../../lib/form-errors';
import { useSaveCompanySettings, useUploadLogo } from '../api/company-settings';

type Values = Record<string, string>;

function toValues(s: CompanySettings): Values {
  const m = (x: number) => minorToDecimalString(x, s.currency);
  return {
    companyName: s.companyName,
    'address.line1': s.address.line1,
    'address.line2': s.address.line2 ?? '',
    'address.town': s.address.town,
    'address.postcode': s.address.postcode,
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
    wasteAllowancePct: String(Math.round(s.wasteAllowance * 1000) / 10),
    minOffcutMm: String(s.minOffcutMm ?? 500),
    rollCountMethod: s.rollCountMethod,
    eavesMode: s.eavesMode ?? 'gap',
    hatchKitInsulationMm: String(s.hatchKitInsulationMm ?? 0),
    'labour.baseM2PerHour': String(s.labour.baseM2PerHour),
    'labour.crossM2PerHour': String(s.labour.crossM2PerHour),
    'labour.hourlyRate': m(s.labour.hourlyRateMinor),
    'labour.hourlyCost': m(s.labour.hourlyCostMinor),
    'labour.crewSize': String(s.labour.crewSize),
    'labour.minimumCharge': m(s.labour.minimumChargeMinor),
    'labour.roundUpMinutes': String(s.labour.roundUpMinutes),
    'labour.taxClass': s.labour.taxClass,
    'extraRules.pipeLaggingMPerTank': String(s.extraRules.pipeLaggingMPerTank),
    'extraRules.walkwayBoardsPerTank': String(s.extraRules.walkwayBoardsPerTank),
    'extraRules.boardLegsPerM2': String(s.extraRules.boardLegsPerM2),
    'extraRules.disposalPerJob': String(s.extraRules.disposalPerJob),
    'extraRules.eavesTrays': String(s.extraRules.eavesTrays),
  };
}

function toBody(v: Values) {
  const n = (k: string) => (v[k].trim() === '' ? Number.NaN : Number(v[k]));
  const money = (k: string) => parseMoney(v[k], v.currency || 'GBP') ?? Number.NaN;
  return {
    companyName: v.companyName,
    address: { line1: v['address.line1'], line2: v['address.line2'], town: v['address.town'], postcode: v['address.postcode'] },
    email: v.email,
    phone: v.phone,
    taxNumber: v.taxNumber,
    terms: v.terms,
    validityDays: n('validityDays'),
    currency: v.currency.trim().toUpperCase(),
    locale: v.locale,
    degreeDays: n('degreeDays'),
    fuelPriceMinorPerKwh: n('fuelPriceMinorPerKwh'),
    heatingEfficiency: n('heatingEfficiency'),
    wasteAllowance: n('wasteAllowancePct') / 100,
    minOffcutMm: n('minOffcutMm'),
    rollCountMethod: v.rollCountMethod,
    eavesMode: v.eavesMode,
    hatchKitInsulationMm: n('hatchKitInsulationMm'),
    labour: {
      baseM2PerHour: n('labour.baseM2PerHour'),
      crossM2PerHour: n('labour.crossM2PerHour'),
      hourlyRateMinor: money('labour.hourlyRate'),
      hourlyCostMinor: money('labour.hourlyCost'),
      crewSize: n('labour.crewSize'),
      minimumChargeMinor: money('labour.minimumCharge'),
      roundUpMinutes: n('labour.roundUpMinutes'),
      taxClass: v['labour.taxClass'],
    },
    extraRules: {
      pipeLaggingMPerTank: n('extraRules.pipeLaggingMPerTank'),
      walkwayBoardsPerTank: n('extraRules.walkwayBoardsPerTank'),
      boardLegsPerM2: n('extraRules.boardLegsPerM2'),
      disposalPerJob: n('extraRules.disposalPerJob'),
      eavesTrays: v['extraRules.eavesTrays'] === 'true',
    },
  };
}

const KEY_ALIASES: Record<string, string> = {
  wasteAllowance: 'wasteAllowancePct',
  minOffcutMm: 'minOffcutMm',
  'labour.hourlyRateMinor': 'labour.hourlyRate',
  'labour.hourlyCostMinor': 'labour.hourlyCost',
  'labour.minimumChargeMinor': 'labour.minimumCharge',
};

/** The company's details, quote terms, savings inputs, labour rates and extras rules, checked with the server's schema. */
export function CompanySettingsForm({ settings, section }: { settings: CompanySettings; section: 'company' | 'pricing' }) {
  const [v, setV] = useState<Values>(() => toValues(settings));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState(false);
  const save = useSaveCompanySettings();
  const logo = useUploadLogo();
  // Bumped after each upload so the <img> fetches the new logo (the route answers no-cache).
  const [logoVersion, setLogoVersion] = useState(0);
  // New settings from the server (after a save) replace the form's values, during render rather
  // than in an effect so the stale values are never drawn.
  const [shown, setShown] = useState(settings);
  if (shown !== settings) {
    setShown(settings);
    setV(toValues(settings));
  }

  const field = (key: string, label: string, opts: { hint?: string; type?: string; area?: boolean; options?: Array<[string, string]> } = {}) => (
    <Field label={label} hint={opts.hint} error={errors[key]}>
      {opts.options ? (
        <Select value={v[key]} onChange={(e) => setV({ ...v, [key]: e.target.value })}>
          {opts.options.map(([val, text]) => (
            <option key={val} value={val}>
              {text}
            </option>
          ))}
        </Select>
      ) : opts.area ? (
        <Textarea rows={6} value={v[key]} onChange={(e) => setV({ ...v, [key]: e.target.value })} />
      ) : (
        <Input type={opts.type ?? 'text'} value={v[key]} onChange={(e) => setV({ ...v, [key]: e.target.value })} />
      )}
    </Field>
  );

  const submit = async () => {
    setSaved(false);
    const parsed = companySettingsBodySchema.safeParse(toBody(v));
    if (!parsed.success) {
      setErrors(
        Object.fromEntries(
          parsed.error.issues.map((i) => {
            const k = i.path.join('.');
            return [KEY_ALIASES[k] ?? k, i.message];
          }),
        ),
      );
      return;
    }
    setErrors({});
    try {
      await save.mutateAsync(parsed.data);
      setSaved(true);
    } catch (e) {
      setErrors(serverFieldErrors(e));
    }
  };

  return (
    <form
      className="flex flex-col gap-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      {section === 'company' ? (
        <>
          <Card>
            <CardTitle>Company on quotes</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              {field('companyName', 'Company name')}
              {field('taxNumber', 'VAT / tax number')}
              {field('address.line1', 'Address line 1')}
              {field('address.line2', 'Address line 2')}
              {field('address.town', 'Town')}
              {field('address.postcode', 'Postcode')}
              {field('email', 'E-mail for quotes and replies', { hint: 'Accepted and declined quotes are announced here.' })}
              {field('phone', 'Phone')}
            </div>
            <div className="mt-4 flex flex-wrap items-center gap-3">
              {settings.hasLogo && (
                <img src={`/api/settings/logo?v=${logoVersion}`} alt="Company logo" className="h-12 w-auto rounded border border-paper-line bg-white p-1" />
              )}
              <label className="text-sm">
                <span className="mr-2 font-medium">Logo (PNG or JPEG, up to 1 MB)</span>
                <input
                  type="file"
                  accept="image/png,image/jpeg"
                  onChange={(e) => {
                    const f = e.target.files?.[0];
                    if (f) logo.mutate(f, { onSuccess: () => setLogoVersion((n) => n + 1) });
                  }}
                />
              </label>
              {logo.error && <Alert>{logo.error.message}</Alert>}
            </div>
          </Card>
          <Card>
            <CardTitle>Quotes</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
              {field('validityDays', 'Valid for (days)', { type: 'number' })}
              {field('currency', 'Currency', { hint: 'Three letters, e.g. GBP, EUR.' })}
              {field('locale', 'Number and date format', { hint: 'e.g. en-GB' })}
            </div>
            <div className="mt-3">{field('terms', 'Terms (one per line)', { area: true })}</div>
          </Card>
        </>
      ) : (
        <>
          <Card>
            <CardTitle>Labour</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-4">
              {field('labour.baseM2PerHour', 'Base layer, m² per hour')}
              {field('labour.crossM2PerHour', 'Cross layer, m² per hour')}
              {field('labour.hourlyRate', 'Charge per person-hour')}
              {field('labour.hourlyCost', 'Cost per person-hour')}
              {field('labour.crewSize', 'Crew size')}
              {field('labour.minimumCharge', 'Minimum labour charge')}
              {field('labour.roundUpMinutes', 'Round labour up to (minutes)')}
              {field('labour.taxClass', 'Labour tax class', { options: Object.entries(TAX_CLASS_LABELS) })}
            </div>
          </Card>
          <Card>
            <CardTitle>Rolls and waste</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              {field('wasteAllowancePct', 'Waste allowance (%)', { hint: 'For the rule-of-thumb count; common practice is 5–10%.' })}
              {field('minOffcutMm', 'Minimum usable offcut (mm)', { hint: 'Shorter ends are not butted in or kept; 500 mm is common practice.' })}
              {field('rollCountMethod', 'Price rolls by', {
                options: [
                  ['packing', 'the roll plan (strips packed into rolls)'],
                  ['area', 'the rule of thumb (area + waste)'],
                ],
              })}
            </div>
          </Card>
          <Card>
            <CardTitle>Extras the plan implies</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-5">
              {field('extraRules.pipeLaggingMPerTank', 'Pipe lagging per tank (m)')}
              {field('extraRules.walkwayBoardsPerTank', 'Walkway boards per tank')}
              {field('extraRules.boardLegsPerM2', 'Board legs per m² boarded')}
              {field('extraRules.disposalPerJob', 'Disposal per job')}
              {field('extraRules.eavesTrays', 'Eaves trays', {
                options: [
                  ['true', 'one per rafter space'],
                  ['false', 'none'],
                ],
              })}
            </div>
          </Card>
          <Card>
            <CardTitle>Eaves and hatch</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              {field('eavesMode', 'Eaves, on plans that do not choose', {
                hint: 'Either way the air path from the eaves stays open (BS 5250). A plan can choose otherwise in the editor.',
                options: [
                  ['gap', 'keep the insulation back (ventilation gap)'],
                  ['ventilators', 'eaves ventilators, insulation over the wall plate'],
                ],
              })}
              {field('hatchKitInsulationMm', 'Hatch kit insulation on the lid (mm)', {
                hint: 'What your hatch kit adds; counted in the whole-ceiling U-value while an active hatch kit is in the catalogue. 0 = no credit.',
              })}
            </div>
          </Card>
          <Card>
            <CardTitle>Savings estimate</CardTitle>
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
              {field('degreeDays', 'Heating degree days (K·day a year)', { hint: 'UK standard year, base 15.5 °C: about 2,462.' })}
              {field('fuelPriceMinorPerKwh', 'Fuel price (minor units per kWh)', { hint: 'e.g. 6.5 for 6.5p/kWh' })}
              {field('heatingEfficiency', 'Heating efficiency (0–1)', { hint: 'Condensing gas boiler about 0.85–0.90.' })}
            </div>
          </Card>
        </>
      )}
      {saved && <Alert tone="success">Settings saved.</Alert>}
      {Object.keys(errors).length > 0 && <Alert>Some fields need attention.</Alert>}
      <div>
        <Button type="submit" busy={save.isPending}>
          Save settings
        </Button>
      </div>
    </form>
  );
}

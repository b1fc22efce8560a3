import { useMemo, useState } from 'react';
import { FormProvider, type Path } from 'react-hook-form';
import { ACTUALS_PARTS, TAX_CLASS_LABELS, type ActualsPart, type CompanySettings } from '../../../../shared/api/settings';
import { Alert, Button, Card, CardTitle, Input, Textarea } from '../../../components/ui';
import { FormField, FormSelect, hasFieldErrors, showServerErrors, useZodForm } from '../../../lib/forms';
import { useSaveCompanySettings, useUploadLogo } from '../api/company-settings';
import { settingsFormSchema, settingsFormValues, type SettingsFormValues } from './settings-form-schema';

const PART_LABELS: Record<ActualsPart, string> = {
  rolls: 'Rolls used and brought back',
  hours: 'Hours on site, per installer',
  extras: 'Extras used (kits, covers, boards)',
};

/** The company's details, quote terms, savings inputs, labour rates and extras rules, checked with the server's schema. */
export function CompanySettingsForm({ settings, section }: { settings: CompanySettings; section: 'company' | 'pricing' }) {
  // New settings from the server (after a save) replace the form's values.
  const values = useMemo(() => settingsFormValues(settings), [settings]);
  const form = useZodForm(settingsFormSchema, { values });
  const [saved, setSaved] = useState(false);
  const save = useSaveCompanySettings();
  const logo = useUploadLogo();
  // Bumped after each upload so the <img> fetches the new logo (the route answers no-cache).
  const [logoVersion, setLogoVersion] = useState(0);

  const field = (
    name: Path<SettingsFormValues>,
    label: string,
    opts: { hint?: string; type?: string; area?: boolean; options?: Array<[string, string]> } = {},
  ) => (
    <FormField name={name} label={label} hint={opts.hint}>
      {opts.options ? (
        <FormSelect name={name}>
          {opts.options.map(([val, text]) => (
            <option key={val} value={val}>
              {text}
            </option>
          ))}
        </FormSelect>
      ) : opts.area ? (
        <Textarea rows={6} {...form.register(name)} />
      ) : (
        <Input type={opts.type ?? 'text'} {...form.register(name)} />
      )}
    </FormField>
  );

  const submit = form.handleSubmit(async (body) => {
    setSaved(false);
    try {
      await save.mutateAsync(body);
      setSaved(true);
    } catch (e) {
      showServerErrors(e, form.setError);
    }
  });

  return (
    <FormProvider {...form}>
      <form className="flex flex-col gap-4" onSubmit={submit} noValidate>
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
                {field('labour.hourlyRateMinor', 'Charge per person-hour')}
                {field('labour.hourlyCostMinor', 'Cost per person-hour')}
                {field('labour.crewSize', 'Crew size')}
                {field('labour.minimumChargeMinor', 'Minimum labour charge')}
                {field('labour.roundUpMinutes', 'Round labour up to (minutes)')}
                {field('labour.taxClass', 'Labour tax class', { options: Object.entries(TAX_CLASS_LABELS) })}
              </div>
            </Card>
            <Card>
              <CardTitle>Finishing a job</CardTitle>
              <fieldset>
                <legend className="mb-2 text-sm">
                  What an installer must fill in before marking a job installed. The phone form is filled from the van load either way; what is recorded feeds
                  the estimate-against-actual report and its suggestions.
                </legend>
                <div className="flex flex-col gap-2 sm:flex-row sm:gap-6">
                  {ACTUALS_PARTS.map((part) => (
                    <label key={part} className="flex min-h-11 items-center gap-2 text-sm">
                      <input type="checkbox" className="h-5 w-5 accent-teal-dark" value={part} {...form.register('actualsRequired')} />
                      {PART_LABELS[part]}
                    </label>
                  ))}
                </div>
              </fieldset>
            </Card>
            <Card>
              <CardTitle>Rolls and waste</CardTitle>
              <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
                {field('wasteAllowance', 'Waste allowance (%)', { hint: 'For the rule-of-thumb count; common practice is 5–10%.' })}
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
        {form.formState.errors.root?.server && <Alert>{form.formState.errors.root.server.message}</Alert>}
        {hasFieldErrors(form.formState.errors) && <Alert>Some fields need attention.</Alert>}
        <div>
          <Button type="submit" busy={save.isPending}>
            Save settings
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}

import { useState } from 'react';
import { EXTRA_KINDS, EXTRA_KIND_LABELS, TAX_CLASS_LABELS, extraBodySchema, productBodySchema, taxRateBodySchema } from '../../../../shared/api/settings';
import { ButtonLink, ErrorState, LoadingState, PageHeader, Tabs } from '../../../components/ui';
import { can } from '../../../../shared/auth/policies';
import { useCurrentUser } from '../../auth';
import { useCompanySettings } from '../api/company-settings';
import { CatalogueTable, type CatalogueColumn } from './catalogue-table';
import { CompanySettingsForm } from './company-settings-form';

const taxOptions = Object.entries(TAX_CLASS_LABELS).map(([value, label]) => ({ value, label }));

const PRODUCT_COLUMNS: CatalogueColumn[] = [
  { key: 'name', label: 'Name', type: 'text', onPhone: true },
  { key: 'supplierCode', label: 'Code', type: 'text' },
  { key: 'thicknessMm', label: 'Thickness mm', type: 'number' },
  { key: 'rollWidthMm', label: 'Width mm', type: 'number' },
  { key: 'lanes', label: 'Lanes', type: 'number' },
  { key: 'rollLengthMm', label: 'Length mm', type: 'number' },
  { key: 'coverageM2', label: 'm²/roll', type: 'number' },
  { key: 'lambdaWmK', label: 'Conductivity W/mK', type: 'number' },
  { key: 'unitPriceMinor', label: 'Price', type: 'money', onPhone: true },
  { key: 'unitCostMinor', label: 'Cost', type: 'money' },
  { key: 'roles', label: 'Roles', type: 'roles', inTable: false },
  { key: 'taxClass', label: 'Tax', type: 'select', options: taxOptions, inTable: false },
  { key: 'active', label: 'Active', type: 'bool', onPhone: true },
];

const EXTRA_COLUMNS: CatalogueColumn[] = [
  { key: 'kind', label: 'Kind', type: 'select', options: EXTRA_KINDS.map((k) => ({ value: k, label: EXTRA_KIND_LABELS[k] })) },
  { key: 'name', label: 'Name', type: 'text', onPhone: true },
  { key: 'unit', label: 'Unit', type: 'select', options: ['each', 'm', 'job'].map((u) => ({ value: u, label: u })) },
  { key: 'unitPriceMinor', label: 'Price', type: 'money', onPhone: true },
  { key: 'unitCostMinor', label: 'Cost', type: 'money' },
  { key: 'minutesPerUnit', label: 'Minutes each', type: 'number' },
  { key: 'taxClass', label: 'Tax', type: 'select', options: taxOptions },
  { key: 'active', label: 'Active', type: 'bool', onPhone: true },
];

const TAX_COLUMNS: CatalogueColumn[] = [
  { key: 'taxClass', label: 'Class', type: 'select', options: taxOptions, onPhone: true },
  { key: 'rateBp', label: 'Rate %', type: 'rate', onPhone: true },
  { key: 'validFrom', label: 'From', type: 'date', onPhone: true },
  { key: 'label', label: 'Label', type: 'text' },
];

const TABS = [
  { value: 'company', label: 'Company and quotes' },
  { value: 'pricing', label: 'Labour, waste, eaves, savings' },
  { value: 'products', label: 'Products' },
  { value: 'extras', label: 'Extras' },
  { value: 'tax', label: 'Tax rates' },
] as const;
type Tab = (typeof TABS)[number]['value'];

/** /settings (office): company details, quote terms, labour and savings inputs, catalogue and dated tax rates. */
export default function SettingsPage() {
  const user = useCurrentUser();
  const settings = useCompanySettings();
  const [tab, setTab] = useState<Tab>('company');
  if (!can(user, 'settings:manage')) {
    return <ErrorState error={new Error('Only office users can change the company settings.')} title="Settings are for the office" />;
  }
  if (settings.isPending) return <LoadingState label="Loading the settings…" />;
  if (settings.isError) return <ErrorState error={settings.error} onRetry={() => settings.refetch()} title="The settings could not be loaded" />;
  const s = settings.data;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Settings"
        subtitle="What quotes are built from and what they print."
        actions={<ButtonLink to="/settings/payments">Deposits and payment terms</ButtonLink>}
      />
      <Tabs label="Settings sections" value={tab} onValueChange={setTab} tabs={TABS} panelClassName="mt-2 flex flex-col gap-4">
        {(tab === 'company' || tab === 'pricing') && <CompanySettingsForm settings={s} section={tab} />}
        {tab === 'products' && (
          <CatalogueTable
            resource="products"
            title="Roll products"
            columns={PRODUCT_COLUMNS}
            schema={productBodySchema}
            currency={s.currency}
            blank={{
              name: '',
              supplierCode: '',
              thicknessMm: 100,
              rollWidthMm: 1140,
              lanes: 1,
              rollLengthMm: 8000,
              coverageM2: 9.12,
              lambdaWmK: 0.044,
              unitPriceMinor: 0,
              unitCostMinor: 0,
              roles: ['base', 'cross'],
              taxClass: 'energy_saving',
              active: true,
            }}
          />
        )}
        {tab === 'extras' && (
          <CatalogueTable
            resource="extras"
            title="Extras"
            columns={EXTRA_COLUMNS}
            schema={extraBodySchema}
            currency={s.currency}
            blank={{ kind: 'other', name: '', unit: 'each', unitPriceMinor: 0, unitCostMinor: 0, minutesPerUnit: 0, taxClass: 'standard', active: true }}
          />
        )}
        {tab === 'tax' && (
          <>
            <CatalogueTable
              resource="tax-rates"
              title="Tax rates by date"
              columns={TAX_COLUMNS}
              schema={taxRateBodySchema}
              currency={s.currency}
              blank={{ taxClass: 'standard', rateBp: 2000, validFrom: new Date().toISOString().slice(0, 10), label: '' }}
            />
            <p className="text-sm text-graphite-light">
              A quote uses, for each line's class, the rate with the latest start date on or before its issue date. The UK defaults follow HMRC VAT Notice
              708/6: installed energy-saving materials zero-rated from 1 May 2023 to 31 March 2027, then 5%; other items 20%. Check the current rules for your
              country.
            </p>
          </>
        )}
      </Tabs>
    </div>
  );
}

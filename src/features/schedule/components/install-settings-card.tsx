import { useState } from 'react';
import type { InstallSettings } from '../../../../shared/api/schedule';
import { Alert, Button, Card, CardTitle, Field, Input } from '../../../components/ui';
import { useInstallSettings, useUpdateInstallSettings } from '../api/install-settings';

/** Day capacity for the warnings and what the customer's handover pack states. */
export function InstallSettingsCard() {
  const settings = useInstallSettings();
  const update = useUpdateInstallSettings();
  const [form, setForm] = useState<InstallSettings | null>(null);
  // Fresh settings from the server replace the form (adjusted during render, not in an effect).
  const [shown, setShown] = useState<InstallSettings | undefined>(undefined);
  if (settings.data !== shown) {
    setShown(settings.data);
    if (settings.data) setForm(settings.data);
  }
  if (!form) return null;
  return (
    <Card>
      <CardTitle>Install settings</CardTitle>
      <form
        className="grid gap-3 sm:grid-cols-2"
        onSubmit={(e) => {
          e.preventDefault();
          update.mutate(form);
        }}
      >
        <Field label="Jobs per installer a day">
          <Input type="number" min={1} max={20} value={form.maxJobsPerDay} onChange={(e) => setForm({ ...form, maxJobsPerDay: Number(e.target.value) })} />
        </Field>
        <Field label="Area per installer a day (m²)">
          <Input
            type="number"
            min={1}
            max={10000}
            value={form.maxAreaM2PerDay}
            onChange={(e) => setForm({ ...form, maxAreaM2PerDay: Number(e.target.value) })}
          />
        </Field>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.handoverRValues} onChange={(e) => setForm({ ...form, handoverRValues: e.target.checked })} />
          Handover pack states R-values (SI and imperial)
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={form.handoverReceipt} onChange={(e) => setForm({ ...form, handoverReceipt: e.target.checked })} />
          Add a signed receipt of the insulation installed
        </label>
        <div className="sm:col-span-2 flex items-center gap-3">
          <Button type="submit" size="sm" busy={update.isPending}>
            Save
          </Button>
          {update.isSuccess && <Alert tone="success">Saved.</Alert>}
          {update.isError && <Alert>{update.error.message}</Alert>}
        </div>
      </form>
    </Card>
  );
}

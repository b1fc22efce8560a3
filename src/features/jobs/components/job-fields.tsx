import { JOB_STAGES, type Job, type JobStage } from '../../../../shared/api/jobs';
import { AddressFields, addressValues, emptyAddress, type AddressValues } from '../../../components/forms/address-fields';
import { Field, Input, Select, STAGE_LABELS, Textarea } from '../../../components/ui';

export type JobValues = {
  propertyAddress: AddressValues;
  stage: JobStage;
  assignedInstallerId: string;
  installDate: string;
  accessNotes: string;
  notes: string;
};

export const emptyJob = (): JobValues => ({
  propertyAddress: emptyAddress(),
  stage: 'enquiry',
  assignedInstallerId: '',
  installDate: '',
  accessNotes: '',
  notes: '',
});

export const jobValues = (job: Job): JobValues => ({
  propertyAddress: addressValues(job.propertyAddress),
  stage: job.stage,
  assignedInstallerId: job.assignedInstaller?.id ?? '',
  installDate: job.installDate ? job.installDate.slice(0, 10) : '',
  accessNotes: job.accessNotes ?? '',
  notes: job.notes ?? '',
});

/** The body the API takes, from the form's strings ("" means none). */
export function jobBodyFrom(values: JobValues, customerId: string, opts: { canAssign: boolean }) {
  return {
    customerId,
    propertyAddress: values.propertyAddress,
    stage: values.stage,
    ...(opts.canAssign ? { assignedInstallerId: values.assignedInstallerId || null, installDate: values.installDate || null } : {}),
    accessNotes: values.accessNotes,
    notes: values.notes,
  };
}

type Installer = { id: string; name: string };

/** Property, stage, scheduling and notes of a job. Installer and date only for roles that assign. */
export function JobFields({
  value,
  onChange,
  errors,
  installers,
  showPropertyAddress = true,
}: {
  value: JobValues;
  onChange: (next: JobValues) => void;
  errors: Record<string, string>;
  /** null when the user may not assign installers. */
  installers: Installer[] | null;
  showPropertyAddress?: boolean;
}) {
  const set = <K extends keyof JobValues>(k: K, v: JobValues[K]) => onChange({ ...value, [k]: v });
  return (
    <div className="flex flex-col gap-5">
      {showPropertyAddress && (
        <fieldset>
          <legend className="mb-2 text-sm font-semibold">Property</legend>
          <AddressFields value={value.propertyAddress} onChange={(a) => set('propertyAddress', a)} errors={errors} path="propertyAddress" />
        </fieldset>
      )}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <Field label="Stage" error={errors.stage}>
          <Select name="stage" value={value.stage} onChange={(e) => set('stage', e.target.value as JobStage)}>
            {JOB_STAGES.map((s) => (
              <option key={s} value={s}>
                {STAGE_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        {installers && (
          <>
            <Field label="Installer" error={errors.assignedInstallerId}>
              <Select name="assignedInstallerId" value={value.assignedInstallerId} onChange={(e) => set('assignedInstallerId', e.target.value)}>
                <option value="">Not assigned</option>
                {installers.map((i) => (
                  <option key={i.id} value={i.id}>
                    {i.name}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label="Install date" error={errors.installDate}>
              <Input type="date" name="installDate" value={value.installDate} onChange={(e) => set('installDate', e.target.value)} />
            </Field>
          </>
        )}
      </div>
      <Field label="Access notes" error={errors.accessNotes} hint="Parking, keys, pets, where the hatch is, anything the installer must know before arriving.">
        <Textarea name="accessNotes" value={value.accessNotes} onChange={(e) => set('accessNotes', e.target.value)} />
      </Field>
      <Field label="Notes" error={errors.notes}>
        <Textarea name="notes" rows={4} value={value.notes} onChange={(e) => set('notes', e.target.value)} />
      </Field>
    </div>
  );
}

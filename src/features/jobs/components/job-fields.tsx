import { useFormContext } from 'react-hook-form';
import { JOB_STAGES } from '../../../../shared/api/jobs';
import { AddressFields } from '../../../components/forms/address-fields';
import { Input, STAGE_LABELS, Textarea } from '../../../components/ui';
import { FormField, FormSelect } from '../../../lib/forms';

type Installer = { id: string; name: string };
type JobFieldValues = { stage: string; assignedInstallerId: string; installDate: string; accessNotes: string; notes: string };

/** Property, stage, scheduling and notes of a job, named as the API names them. Installer and date only for roles that assign. */
export function JobFields({
  installers,
  showPropertyAddress = true,
}: {
  /** null when the user may not assign installers. */
  installers: Installer[] | null;
  showPropertyAddress?: boolean;
}) {
  const { register } = useFormContext<JobFieldValues>();
  return (
    <div className="flex flex-col gap-5">
      {showPropertyAddress && (
        <fieldset>
          <legend className="mb-2 text-sm font-semibold">Property</legend>
          <AddressFields path="propertyAddress" />
        </fieldset>
      )}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <FormField name="stage" label="Stage">
          <FormSelect name="stage">
            {JOB_STAGES.map((s) => (
              <option key={s} value={s}>
                {STAGE_LABELS[s]}
              </option>
            ))}
          </FormSelect>
        </FormField>
        {installers && (
          <>
            <FormField name="assignedInstallerId" label="Installer">
              <FormSelect name="assignedInstallerId">
                <option value="">Not assigned</option>
                {installers.map((i) => (
                  <option key={i.id} value={i.id}>
                    {i.name}
                  </option>
                ))}
              </FormSelect>
            </FormField>
            <FormField name="installDate" label="Install date">
              <Input type="date" {...register('installDate')} />
            </FormField>
          </>
        )}
      </div>
      <FormField name="accessNotes" label="Access notes" hint="Parking, keys, pets, where the hatch is, anything the installer must know before arriving.">
        <Textarea {...register('accessNotes')} />
      </FormField>
      <FormField name="notes" label="Notes">
        <Textarea rows={4} {...register('notes')} />
      </FormField>
    </div>
  );
}

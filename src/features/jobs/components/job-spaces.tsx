import { useState } from 'react';
import { FormProvider } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { spaceBodySchema } from '../../../../shared/api/spaces';
import type { Job } from '../../../../shared/api/jobs';
import { Alert, Button, Card, CardTitle, EmptyState, Input, formatDateTime } from '../../../components/ui';
import { FormField, showServerErrors, useZodForm } from '../../../lib/forms';
import { formErrorMessage } from '../../../lib/forms/server-errors';
import { useCreateSpace } from '../api/create-space';
import { useRemoveSpace } from '../api/remove-space';

/** The loft spaces of a job, each opening its plan; plus a small form to add one. */
export function JobSpaces({ job, canEdit }: { job: Job; canEdit: boolean }) {
  const [adding, setAdding] = useState(false);
  const create = useCreateSpace(job.id);
  const { remove, restore } = useRemoveSpace(job.id);
  // The space just removed, offered back until another is removed or the page is left.
  const [removed, setRemoved] = useState<{ id: string; name: string } | null>(null);

  return (
    <Card>
      <CardTitle
        action={
          canEdit && !adding ? (
            <Button size="sm" variant="secondary" onClick={() => setAdding(true)}>
              Add space
            </Button>
          ) : null
        }
      >
        Loft spaces
      </CardTitle>
      {adding && <AddSpaceForm create={create} onClose={() => setAdding(false)} />}
      {removed && (
        <div
          role="status"
          className="mb-3 flex flex-wrap items-center justify-between gap-2 rounded-md border border-graphite/20 bg-paper-dark/60 px-3 py-2 text-sm"
        >
          <span>“{removed.name}” removed, with its plan kept.</span>
          <Button size="sm" variant="secondary" busy={restore.isPending} onClick={() => restore.mutate(removed.id, { onSuccess: () => setRemoved(null) })}>
            Undo
          </Button>
        </div>
      )}
      {(remove.isError || restore.isError) && <Alert>{formErrorMessage(remove.error ?? restore.error)}</Alert>}
      {job.spaces.length === 0 ? (
        <EmptyState title="No spaces yet">Each loft area (main loft, garage loft, extension) gets its own space and plan.</EmptyState>
      ) : (
        <ul className="divide-y divide-paper-line">
          {job.spaces.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2.5">
              <div>
                <div className="font-medium">{s.name}</div>
                <div className="font-mono text-xs text-graphite-light">
                  {s.latestRevision ? `revision ${s.latestRevision} · saved ${formatDateTime(s.latestRevisionAt ?? s.updatedAt)}` : 'no plan yet'}
                </div>
              </div>
              <div className="flex items-center gap-3">
                <Link to={`/spaces/${s.id}/edit`} className="text-sm font-medium text-teal-dark hover:underline">
                  {canEdit ? (s.latestRevision ? 'Open plan' : 'Draw plan') : 'View plan'} →
                </Link>
                {canEdit && (
                  <Button
                    size="sm"
                    variant="danger-ghost"
                    aria-label={`Remove ${s.name}`}
                    busy={remove.isPending && remove.variables === s.id}
                    onClick={() => remove.mutate(s.id, { onSuccess: () => setRemoved({ id: s.id, name: s.name }) })}
                  >
                    Remove
                  </Button>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
      <p className="mt-4 border-t border-paper-line pt-3 text-xs leading-relaxed text-graphite-light">
        <strong className="text-graphite">Surveying a loft:</strong> use a secure ladder, tread only on joists or boards, keep clear of cables and flues, and
        wear a mask, gloves and goggles near mineral wool. Local building regulations and licensed practice take precedence.
      </p>
    </Card>
  );
}

/** The name of a new loft space, checked with the API's spaceBodySchema. */
function AddSpaceForm({ create, onClose }: { create: ReturnType<typeof useCreateSpace>; onClose: () => void }) {
  const form = useZodForm(spaceBodySchema, { defaultValues: { name: '' } });
  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await create.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
      return;
    }
    onClose();
  });
  const formError = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form
        onSubmit={onSubmit}
        noValidate
        className="mb-4 flex flex-col gap-2 rounded-md bg-paper-dark/60 p-3 sm:flex-row sm:items-start"
        aria-label="Add space"
      >
        <FormField name="name" label="Name of the space" className="flex-1" hint="For example: Main loft, Garage loft, Extension.">
          <Input autoFocus {...form.register('name')} />
        </FormField>
        <div className="flex gap-2 sm:mt-6">
          <Button type="submit" busy={create.isPending}>
            Add
          </Button>
          <Button variant="ghost" onClick={onClose}>
            Cancel
          </Button>
        </div>
        {formError && <Alert>{formError}</Alert>}
      </form>
    </FormProvider>
  );
}

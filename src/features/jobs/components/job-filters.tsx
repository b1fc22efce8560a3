import { useState } from 'react';
import { JOB_SORTS, JOB_STAGES, type JobStage } from '../../../../shared/api/jobs';
import { Button, Field, Input, Select, STAGE_LABELS } from '../../../components/ui';

export type JobSort = (typeof JOB_SORTS)[number];
export type JobFilterValues = { q: string; stage: JobStage | ''; installerId: string; sort: JobSort; dir: 'asc' | 'desc' };

export const SORT_LABELS: Record<JobSort, string> = {
  updated: 'Last changed',
  created: 'Date created',
  stage: 'Stage',
  customer: 'Customer name',
  installDate: 'Install date',
};

/** Search box, stage and installer filters and sort order of the jobs list. `installers` null hides that filter. */
export function JobFilters({
  value,
  onChange,
  installers,
}: {
  value: JobFilterValues;
  onChange: (next: Partial<JobFilterValues>) => void;
  installers: Array<{ id: string; name: string }> | null;
}) {
  // On a phone only the search box shows until the person asks for the rest.
  const [open, setOpen] = useState(false);
  const active = (value.stage ? 1 : 0) + (value.installerId ? 1 : 0);
  return (
    <div
      className={`mb-4 grid grid-cols-1 gap-3 rounded-lg border border-paper-line bg-white/60 p-3 ${
        installers
          ? 'sm:grid-cols-2 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)_minmax(0,1.4fr)]'
          : 'sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1.4fr)]'
      }`}
    >
      <div className="flex items-end gap-2">
        <Field label="Search all jobs" className="min-w-0 flex-1">
          <Input type="search" placeholder="Name, address, postcode or ref" value={value.q} onChange={(e) => onChange({ q: e.target.value })} />
        </Field>
        <Button
          variant="secondary"
          className="h-10 shrink-0 sm:hidden"
          aria-expanded={open}
          aria-controls="job-filters-more"
          onClick={() => setOpen((o) => !o)}
        >
          Filters{active ? ` (${active})` : ''}
        </Button>
      </div>
      <div id="job-filters-more" className={`${open ? 'grid' : 'hidden'} grid-cols-1 gap-3 sm:contents`}>
        <Field label="Stage">
          <Select value={value.stage} onChange={(e) => onChange({ stage: e.target.value as JobStage | '' })}>
            <option value="">All stages</option>
            {JOB_STAGES.map((s) => (
              <option key={s} value={s}>
                {STAGE_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        {installers && (
          <Field label="Installer">
            <Select value={value.installerId} onChange={(e) => onChange({ installerId: e.target.value })}>
              <option value="">Anyone</option>
              {installers.map((i) => (
                <option key={i.id} value={i.id}>
                  {i.name}
                </option>
              ))}
            </Select>
          </Field>
        )}
        <div className="flex items-end gap-2">
          <Field label="Sort all jobs by" className="flex-1">
            <Select value={value.sort} onChange={(e) => onChange({ sort: e.target.value as JobSort })}>
              {JOB_SORTS.map((s) => (
                <option key={s} value={s}>
                  {SORT_LABELS[s]}
                </option>
              ))}
            </Select>
          </Field>
          <Button
            variant="secondary"
            className="h-10 w-24 shrink-0"
            aria-label={value.dir === 'asc' ? 'Ascending order; switch to descending' : 'Descending order; switch to ascending'}
            onClick={() => onChange({ dir: value.dir === 'asc' ? 'desc' : 'asc' })}
          >
            {value.dir === 'asc' ? '↑ Asc' : '↓ Desc'}
          </Button>
        </div>
      </div>
    </div>
  );
}

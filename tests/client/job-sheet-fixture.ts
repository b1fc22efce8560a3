import type { JobSheet } from '../../shared/api/job-sheet';

/** The installer the sheets below are assigned to. */
export const me = { id: 'u1', name: 'Sam Ridley' };

/** A job sheet with two spaces, one check ticked and one after photo; `job` overrides job fields. */
export function sheet(job: Partial<JobSheet['job']> = {}): JobSheet {
  const space = (id: string, name: string) => ({
    id,
    name,
    revision: 1,
    plan: null,
    netAreaM2: 20,
    uValueBefore: 0.4,
    uValueAfter: 0.16,
    thermalText: null,
    layers: [],
    rolls: [],
    problem: null,
    checks: [
      { code: 'ppe.dust', title: 'PPE worn', detail: '' },
      { code: 'downlight.covers', title: 'Downlight covers fitted', detail: '' },
    ],
  });
  return {
    job: {
      id: 'j1',
      reference: 'Q-1',
      stage: 'scheduled',
      installDate: '2027-01-04',
      propertyAddress: { line1: '1 Lane', line2: '', town: 'Mill', postcode: 'M1' },
      accessNotes: '',
      notes: '',
      customer: { name: 'Ada', phone: '' },
      installer: me,
      ...job,
    },
    spaces: [space('s1', 'Main loft'), space('s2', 'Garage loft')],
    vanLoad: { rolls: [], extras: [] },
    cautions: [],
    ticks: [{ kind: 'check', spaceId: 's1', ref: 'ppe.dust', done: true, reason: '', by: me, at: '2027-01-04T09:00:00Z' }],
    notes: [],
    photos: [{ id: 'p1', spaceId: 's1', stage: 'after', caption: '', widthPx: 1, heightPx: 1, url: '', thumbUrl: '', by: me, at: '2027-01-04T10:00:00Z' }],
    completion: null,
    actualsRequired: [],
    actuals: null,
  };
}

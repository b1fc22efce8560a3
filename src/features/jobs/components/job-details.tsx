import type { Job } from '../../../../shared/api/jobs';
import { Card, CardTitle, formatAddress, formatDate } from '../../../components/ui';

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="grid grid-cols-[5.5rem_minmax(0,1fr)] gap-2 py-1.5 text-sm sm:grid-cols-[7.5rem_minmax(0,1fr)]">
      <dt className="text-graphite-light">{label}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

const none = <span className="text-graphite-faint">—</span>;

/** Customer, property and scheduling facts of a job. */
export function JobDetails({ job }: { job: Job }) {
  return (
    <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
      <Card>
        <CardTitle>Customer</CardTitle>
        <dl>
          <Row label="Name">{job.customer.name}</Row>
          <Row label="E-mail">
            {job.customer.email ? (
              <a className="text-teal-dark hover:underline" href={`mailto:${job.customer.email}`}>
                {job.customer.email}
              </a>
            ) : (
              none
            )}
          </Row>
          <Row label="Phone">
            {job.customer.phone ? (
              <a className="text-teal-dark hover:underline" href={`tel:${job.customer.phone}`}>
                {job.customer.phone}
              </a>
            ) : (
              none
            )}
          </Row>
        </dl>
      </Card>
      <Card>
        <CardTitle>Property</CardTitle>
        <dl>
          <Row label="Address">{formatAddress(job.propertyAddress)}</Row>
          <Row label="Installer">{job.assignedInstaller?.name ?? 'Not assigned'}</Row>
          <Row label="Install date">{job.installDate ? <span className="font-mono">{formatDate(job.installDate)}</span> : none}</Row>
          <Row label="Access">{job.accessNotes || none}</Row>
        </dl>
      </Card>
      {job.notes && (
        <Card className="md:col-span-2">
          <CardTitle>Notes</CardTitle>
          <p className="whitespace-pre-wrap text-sm">{job.notes}</p>
        </Card>
      )}
    </div>
  );
}

import { Link } from 'react-router-dom';
import { StageBadge, Table, TBody, Td, Th, THead, Tr, formatAddress, formatDate } from '../../../components/ui';
import type { JobListItem } from '../api/get-jobs';

/** The jobs as a table on wide screens and as stacked cards on a phone. */
export function JobsTable({ jobs }: { jobs: JobListItem[] }) {
  return (
    <>
      <div className="hidden md:block">
        <Table aria-label="Jobs">
          <THead>
            <tr>
              <Th>Ref</Th>
              <Th>Customer</Th>
              <Th>Property</Th>
              <Th>Stage</Th>
              <Th>Installer</Th>
              <Th>Install date</Th>
            </tr>
          </THead>
          <TBody>
            {jobs.map((job) => (
              <Tr key={job.id} className="hover:bg-straw-light/20">
                <Td className="font-mono text-xs whitespace-nowrap">
                  <Link to={`/jobs/${job.id}`} className="text-teal-dark hover:underline">
                    {job.reference}
                  </Link>
                </Td>
                <Td className="font-medium">
                  <Link to={`/jobs/${job.id}`} className="hover:underline">
                    {job.customer.name}
                  </Link>
                </Td>
                <Td className="text-graphite-light">{formatAddress(job.propertyAddress)}</Td>
                <Td>
                  <StageBadge stage={job.stage} />
                </Td>
                <Td className="whitespace-nowrap">{job.assignedInstaller?.name ?? <span className="text-graphite-faint">—</span>}</Td>
                <Td className="whitespace-nowrap font-mono text-xs">{formatDate(job.installDate) || <span className="text-graphite-faint">—</span>}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      </div>
      <ul className="flex flex-col gap-2 md:hidden" aria-label="Jobs">
        {jobs.map((job) => (
          <li key={job.id}>
            <Link to={`/jobs/${job.id}`} className="block rounded-lg border border-paper-line bg-white/85 p-3 shadow-sm active:bg-straw-light/30">
              <div className="flex items-start justify-between gap-2">
                <span className="font-medium">{job.customer.name}</span>
                <StageBadge stage={job.stage} />
              </div>
              <div className="mt-0.5 text-sm text-graphite-light">{formatAddress(job.propertyAddress)}</div>
              <div className="mt-1.5 flex flex-wrap gap-x-3 font-mono text-xs text-graphite-light">
                <span>{job.reference}</span>
                {job.assignedInstaller && <span>{job.assignedInstaller.name}</span>}
                {job.installDate && <span>{formatDate(job.installDate)}</span>}
              </div>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}

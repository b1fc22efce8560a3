import { createColumnHelper, type SortingState } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table/data-table';
import type { ServerPages } from '../../../components/data-table/server-pager';
import { StageBadge, formatAddress, formatDate } from '../../../components/ui';
import type { JobListItem } from '../api/get-jobs';
import type { JobSort } from './job-filters';

const col = createColumnHelper<JobListItem>();
const none = <span className="text-graphite-faint">—</span>;
// Below md only the customer (with the rest folded under it) and the stage show.
const wide = 'hidden md:table-cell';

// Column ids that are sort keys of GET /api/jobs: their headers ask the server for that order.
const columns = [
  col.accessor('reference', {
    header: 'Ref',
    enableSorting: false,
    meta: { className: `${wide} font-mono text-xs whitespace-nowrap` },
    cell: (c) => (
      <Link to={`/jobs/${c.row.original.id}`} className="text-teal-dark hover:underline">
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor((j) => j.customer.name, {
    id: 'customer' satisfies JobSort,
    header: 'Customer',
    sortDescFirst: false,
    meta: { className: 'font-medium' },
    cell: (c) => {
      const job = c.row.original;
      return (
        <>
          <Link to={`/jobs/${job.id}`} className="hover:underline">
            {c.getValue()}
          </Link>
          <div className="mt-0.5 text-sm font-normal text-graphite-light md:hidden">{formatAddress(job.propertyAddress)}</div>
          <div className="mt-1 flex flex-wrap gap-x-3 font-mono text-xs font-normal text-graphite-light md:hidden">
            <span>{job.reference}</span>
            {job.assignedInstaller && <span>{job.assignedInstaller.name}</span>}
            {job.installDate && <span>{formatDate(job.installDate)}</span>}
          </div>
        </>
      );
    },
  }),
  col.accessor((j) => formatAddress(j.propertyAddress), {
    id: 'property',
    header: 'Property',
    enableSorting: false,
    meta: { className: `${wide} text-graphite-light` },
  }),
  col.accessor('stage', { id: 'stage' satisfies JobSort, header: 'Stage', sortDescFirst: false, cell: (c) => <StageBadge stage={c.getValue()} /> }),
  col.accessor((j) => j.assignedInstaller?.name ?? '', {
    id: 'installer',
    header: 'Installer',
    enableSorting: false,
    meta: { className: `${wide} whitespace-nowrap` },
    cell: (c) => c.getValue() || none,
  }),
  col.accessor('installDate', {
    id: 'installDate' satisfies JobSort,
    header: 'Install date',
    sortDescFirst: false,
    meta: { className: `${wide} whitespace-nowrap font-mono text-xs` },
    cell: (c) => formatDate(c.getValue()) || none,
  }),
  col.accessor('updatedAt', {
    id: 'updated' satisfies JobSort,
    header: 'Last changed',
    sortDescFirst: true,
    meta: { className: 'hidden lg:table-cell whitespace-nowrap font-mono text-xs text-graphite-light' },
    cell: (c) => formatDate(c.getValue()),
  }),
];

/**
 * The jobs list as the server sends it: searched, filtered and sorted by GET /api/jobs across all
 * the jobs (a header asks the server for its order), a page at a time. `sort` is the list's order.
 */
export function JobsTable({
  jobs,
  sort,
  onSort,
  pages,
}: {
  jobs: JobListItem[];
  sort: { key: JobSort; dir: 'asc' | 'desc' };
  onSort: (key: JobSort, dir: 'asc' | 'desc') => void;
  pages: ServerPages;
}) {
  const sorting: SortingState = [{ id: sort.key, desc: sort.dir === 'desc' }];
  return (
    <DataTable
      label="Jobs"
      data={jobs}
      columns={columns as never}
      rowId={(j) => j.id}
      sort={{ sorting, onSortingChange: (next) => next[0] && onSort(next[0].id as JobSort, next[0].desc ? 'desc' : 'asc') }}
      serverPages={pages}
      rowClassName={() => 'hover:bg-straw-light/20'}
    />
  );
}

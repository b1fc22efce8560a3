import { Link } from 'react-router-dom';
import type { ScheduleWeek } from '../../../../shared/api/schedule';
import { StageBadge, formatDate } from '../../../components/ui';

const dayLabel = (iso: string) => formatDate(iso, { weekday: true, year: false });

/** Installers down the side, days across; each cell lists that installer's jobs and flags a day over capacity. */
export function WeekGrid({ week }: { week: ScheduleWeek }) {
  if (week.installers.length === 0) return <p className="text-sm text-graphite-light">No active installers yet: invite one on the Users page.</p>;
  return (
    <>
      <DayList week={week} />
      <div className="hidden overflow-x-auto rounded-lg border border-paper-line bg-white/85 shadow-sm md:block">
        <table className="w-full min-w-[56rem] border-collapse text-sm">
          <thead>
            <tr>
              <th className="w-36 border-b border-paper-line p-2 text-left font-semibold">Installer</th>
              {week.days.map((d) => (
                <th key={d} className="border-b border-l border-paper-line p-2 text-left font-semibold">
                  {dayLabel(d)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {week.installers.map((inst) => (
              <tr key={inst.id}>
                <th scope="row" className="border-b border-paper-line p-2 text-left align-top font-medium">
                  {inst.name}
                </th>
                {week.days.map((d) => {
                  const jobs = week.jobs.filter((j) => j.installerId === inst.id && j.installDate === d);
                  const load = week.loads.find((l) => l.installerId === inst.id && l.date === d);
                  return (
                    <td
                      key={d}
                      className={`border-b border-l border-paper-line p-1.5 align-top ${load?.overCapacity ? 'bg-brick-light/30' : ''}`}
                      data-testid={`cell-${inst.id}-${d}`}
                    >
                      {load?.overCapacity && <div className="mb-1 text-xs font-semibold text-brick-dark">Over capacity</div>}
                      <ul className="flex flex-col gap-1">
                        {jobs.map((j) => (
                          <li key={j.id} className="rounded border border-sky-dark/30 bg-sky-light/60 px-1.5 py-1">
                            <Link to={`/jobs/${j.id}`} className="font-mono text-xs font-semibold text-teal-dark underline">
                              {j.reference}
                            </Link>
                            <div className="truncate">{j.customerName}</div>
                            <div className="flex items-center justify-between gap-1 text-xs text-graphite-light">
                              <span className="truncate">
                                {j.town}
                                {j.areaM2 !== null && ` · ${j.areaM2.toFixed(0)} m²`}
                              </span>
                              {j.stage !== 'scheduled' && <StageBadge stage={j.stage} />}
                            </div>
                            {(j.stage === 'installed' || j.stage === 'closed') && <HandoverLink jobId={j.id} />}
                          </li>
                        ))}
                      </ul>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </>
  );
}

/** The installed job's handover pack (PDF), as the customer received it. */
function HandoverLink({ jobId }: { jobId: string }) {
  return (
    <a href={`/api/jobs/${jobId}/handover.pdf`} className="block text-xs font-semibold text-teal-dark underline">
      Handover pack (PDF)
    </a>
  );
}

/** On a phone: day by day, each installer's jobs that day (days with nothing are listed as free). */
function DayList({ week }: { week: ScheduleWeek }) {
  return (
    <ol className="flex flex-col gap-2 md:hidden" aria-label="Installs by day">
      {week.days.map((d) => {
        const jobs = week.jobs.filter((j) => j.installDate === d);
        return (
          <li key={d} className="rounded-lg border border-paper-line bg-white/85 p-3 shadow-sm">
            <div className="font-semibold">{dayLabel(d)}</div>
            {jobs.length === 0 && <div className="text-sm text-graphite-light">Nothing booked</div>}
            {week.installers.map((inst) => {
              const mine = jobs.filter((j) => j.installerId === inst.id);
              if (mine.length === 0) return null;
              const load = week.loads.find((l) => l.installerId === inst.id && l.date === d);
              return (
                <div key={inst.id} className={`mt-2 rounded-md p-2 ${load?.overCapacity ? 'bg-brick-light/30' : 'bg-paper'}`}>
                  <div className="text-sm font-medium">
                    {inst.name}
                    {load?.overCapacity && <span className="ml-2 text-xs font-semibold text-brick-dark">Over capacity</span>}
                  </div>
                  <ul className="mt-1 flex flex-col gap-1 text-sm">
                    {mine.map((j) => (
                      <li key={j.id}>
                        <Link to={`/jobs/${j.id}`} className="font-mono text-xs font-semibold text-teal-dark underline">
                          {j.reference}
                        </Link>{' '}
                        {j.customerName}, {j.town}
                        {j.areaM2 !== null && ` · ${j.areaM2.toFixed(0)} m²`}
                        {j.stage !== 'scheduled' && <StageBadge stage={j.stage} className="ml-1" />}
                        {(j.stage === 'installed' || j.stage === 'closed') && <HandoverLink jobId={j.id} />}
                      </li>
                    ))}
                  </ul>
                </div>
              );
            })}
          </li>
        );
      })}
    </ol>
  );
}

import type { JobStage } from '../../../shared/api/jobs';
import { cn } from '../../lib/cn';

export const STAGE_LABELS: Record<JobStage, string> = {
  enquiry: 'Enquiry',
  surveyed: 'Surveyed',
  quoted: 'Quoted',
  accepted: 'Accepted',
  scheduled: 'Scheduled',
  installed: 'Installed',
  closed: 'Closed',
  declined: 'Declined',
};

const STAGE_TONES: Record<JobStage, string> = {
  enquiry: 'bg-sky-light text-graphite border-sky-dark/30',
  surveyed: 'bg-straw-light text-graphite border-straw-dark/40',
  quoted: 'bg-timber-light/30 text-timber border-timber/30',
  accepted: 'bg-teal-light/60 text-teal-dark border-teal/30',
  scheduled: 'bg-sky text-graphite border-sky-dark/40',
  installed: 'bg-teal-dark text-white border-teal-dark',
  closed: 'bg-paper-dark text-graphite-light border-graphite/20',
  declined: 'bg-brick-light/50 text-brick-dark border-brick/30',
};

/** The job's stage as a small coloured tag. */
export function StageBadge({ stage, className }: { stage: JobStage; className?: string }) {
  return (
    <span className={cn('inline-flex items-center whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-medium', STAGE_TONES[stage], className)}>
      {STAGE_LABELS[stage]}
    </span>
  );
}

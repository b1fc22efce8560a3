import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui';

/**
 * Stand-in pages for routes other engineers build (installer home, job sheet, settings, plan editor).
 * Each one says plainly that the page is not here yet; replace the route in router.tsx with the real page.
 */
function Placeholder({ title, text, back }: { title: string; text: string; back?: { to: string; label: string } }) {
  return (
    <div>
      <PageHeader title={title} subtitle={text} />
      {back && (
        <Link to={back.to} className="text-sm text-teal-dark hover:underline">
          ← {back.label}
        </Link>
      )}
    </div>
  );
}

export function MyJobsPlaceholder() {
  return <Placeholder title="My jobs" text="The installer's list of assigned jobs is not built yet." />;
}

export function JobSheetPlaceholder() {
  const { id } = useParams();
  return <Placeholder title="Job sheet" text="The job sheet is not built yet." back={{ to: `/jobs/${id}`, label: 'Back to the job' }} />;
}

export function SettingsPlaceholder() {
  return <Placeholder title="Settings" text="Company settings (catalogue, prices, labour rates, VAT) are not built yet." />;
}

export function SpaceEditorPlaceholder() {
  return <Placeholder title="Plan editor" text="The plan editor is not built yet." back={{ to: '/jobs', label: 'Back to jobs' }} />;
}

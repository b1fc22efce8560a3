import { formatDate } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import { User } from '../../db/models';
import { ValidationError } from '../../lib/errors';
import { renderJobSheetPdf } from '../../lib/pdf/job-sheet-pdf';
import type { SessionUser } from '../../types';
import { recordJobEvent } from '../jobs/jobs.service';
import { sendCompanyMail } from '../mail/mail.service';
import { loadCompanySettings } from '../settings/settings.service';
import type { createJobSheetService } from './job-sheet.service';

/**
 * The job sheet as a PDF, built from the job sheet's own no-prices view (so the same access rule),
 * and e-mailed by the office to the assigned installer.
 */
export function createJobSheetExportService(deps: AppDeps, sheets: ReturnType<typeof createJobSheetService>) {
  async function pdfFor(user: SessionUser, jobId: string) {
    const sheet = await sheets.sheet(user, jobId);
    const settings = await loadCompanySettings(user.organisationId);
    return { sheet, filename: `job-sheet-${sheet.job.reference}.pdf`, pdf: await renderJobSheetPdf(sheet, settings.companyName) };
  }

  return {
    pdf: pdfFor,

    /** E-mails the sheet to the job's installer and records it on the job's timeline; names the field when it cannot. */
    async sendToInstaller(user: SessionUser, jobId: string): Promise<{ sent: true; to: string }> {
      const { sheet, filename, pdf } = await pdfFor(user, jobId);
      const installer = sheet.job.installer;
      if (!installer) throw new ValidationError([{ path: 'assignedInstallerId', message: 'assign an installer to the job first' }]);
      const row = await User.findOne({ where: { id: installer.id, organisationId: user.organisationId } });
      if (!row?.email) throw new ValidationError([{ path: 'assignedInstallerId', message: 'the assigned installer has no e-mail address' }]);
      const a = sheet.job.propertyAddress;
      const subject = `Job sheet ${sheet.job.reference}: ${a.line1}, ${a.town}${sheet.job.installDate ? ` on ${formatDate(sheet.job.installDate)}` : ''}`;
      await sendCompanyMail(
        deps,
        { organisationId: user.organisationId, jobId: sheet.job.id, userId: user.id, purpose: 'job_sheet', audience: 'staff' },
        {
          to: row.email,
          subject,
          text: [
            `Hello ${installer.name},`,
            '',
            `The job sheet for ${sheet.job.reference} at ${[a.line1, a.town, a.postcode].filter(Boolean).join(', ')} is attached: the plan with numbered strips and lay direction, the cut list by roll, the van load and the site checks.`,
            `Open it on your phone to tick the checks and add photos: ${deps.config.appUrl}/jobs/${sheet.job.id}`,
            '',
            'Work safely: follow the cautions on the first page and local regulations.',
          ].join('\n'),
          attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
        },
      );
      await recordJobEvent({ id: sheet.job.id, organisationId: user.organisationId }, user, 'job_sheet_sent', {
        to: row.email,
        installerId: installer.id,
        text: `Job sheet e-mailed to ${installer.name}`,
      });
      return { sent: true, to: row.email };
    },
  };
}

import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { formatDate } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import { User } from '../../db/models';
import { renderJobSheetPdf } from '../../lib/pdf/job-sheet-pdf';
import { ValidationError } from '../../lib/errors';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import type { SessionUser } from '../../types';
import { createJobSheetService } from '../job-sheet/job-sheet.service';
import { sendCompanyMail } from '../mail/mail.service';
import { recordEvent } from '../quotes/quotes.service';
import { loadCompanySettings } from '../settings/settings.service';

/**
 * /api/jobs/:id/sheet.pdf — the installer's job sheet as a PDF, built from the job sheet API's
 * own no-prices view (the same access rule: installers only for their assigned, scheduled jobs).
 * POST /api/jobs/:id/sheet/send — the office e-mails it to the assigned installer.
 */
export function jobSheetExportRouter(deps: AppDeps) {
  const sheets = createJobSheetService(deps);
  async function pdfFor(user: SessionUser, jobId: string) {
    const sheet = await sheets.sheet(user, jobId);
    const settings = await loadCompanySettings(user.organisationId);
    return { sheet, pdf: await renderJobSheetPdf(sheet, settings.companyName) };
  }
  const r = Router();
  r.get('/:id/sheet.pdf', requireAuth, validate({ params: idParamsSchema }), async (req: Request, res: Response) => {
    const { sheet, pdf } = await pdfFor(currentUser(req), String(req.params.id));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="job-sheet-${sheet.job.reference}.pdf"`);
    res.send(pdf);
  });
  r.post('/:id/sheet/send', requireAuth, requireCan('jobs:assign'), validate({ params: idParamsSchema }), async (req: Request, res: Response) => {
    const user = currentUser(req);
    const { sheet, pdf } = await pdfFor(user, String(req.params.id));
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
        attachments: [{ filename: `job-sheet-${sheet.job.reference}.pdf`, content: pdf, contentType: 'application/pdf' }],
      },
    );
    await recordEvent(user.organisationId, sheet.job.id, user.id, 'job_sheet_sent', {
      to: row.email,
      installerId: installer.id,
      text: `Job sheet e-mailed to ${installer.name}`,
    });
    res.json({ sent: true, to: row.email });
  });
  return r;
}

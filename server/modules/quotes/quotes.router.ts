import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { createQuoteBodySchema, quotePatchSchema, sendQuoteBodySchema } from '../../../shared/api/quotes';
import type { AppDeps } from '../../deps';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { requireCan } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { quoteCsv, quoteXlsx } from './quote-exports';
import { loadCompanySettings } from '../settings/settings.service';
import { quoteFileName, quotePdf } from './quote-document';
import { snapshotOf } from './quote-dto';
import { createQuoteSendService } from './quote-send.service';
import { createQuotesService, findJobInOrg, findQuoteInOrg, linesOf, quoteDto, withDerivedStatus } from './quotes.service';

const params = validate({ params: idParamsSchema });

/** /api/jobs/:id/quotes — list and build. Office and estimators; installers 403. */
export function jobQuotesRouter(deps: AppDeps) {
  const s = createQuotesService(deps);
  const r = Router();
  r.get('/:id/quotes', requireAuth, requireCan('quotes:draft'), params, async (req: Request, res: Response) => {
    res.json({ quotes: await s.listForJob(currentUser(req), String(req.params.id)) });
  });
  r.post(
    '/:id/quotes',
    requireAuth,
    requireCan('quotes:draft'),
    validate({ params: idParamsSchema, body: createQuoteBodySchema }),
    async (req: Request, res: Response) => {
      res.status(201).json({ quote: await s.createFromJob(currentUser(req), String(req.params.id), req.body) });
    },
  );
  return r;
}

/** /api/quotes/:id — read, edit (new version once sent), send (office), exports. */
export function quotesRouter(deps: AppDeps) {
  const s = createQuotesService(deps);
  const send = createQuoteSendService(deps);
  const r = Router();
  r.use(requireAuth, requireCan('quotes:draft'));
  r.get('/:id', params, async (req: Request, res: Response) => {
    res.json({ quote: await s.get(currentUser(req), String(req.params.id)) });
  });
  r.patch('/:id', validate({ params: idParamsSchema, body: quotePatchSchema }), async (req: Request, res: Response) => {
    res.json({ quote: await s.patch(currentUser(req), String(req.params.id), req.body) });
  });
  r.delete('/:id', params, async (req: Request, res: Response) => {
    await s.remove(currentUser(req), String(req.params.id));
    res.status(204).end();
  });
  r.post('/:id/send', requireCan('quotes:manage'), validate({ params: idParamsSchema, body: sendQuoteBodySchema }), async (req: Request, res: Response) => {
    res.json(await send.send(currentUser(req), String(req.params.id), req.body));
  });

  async function exportInput(req: Request) {
    const actor = currentUser(req);
    const q = withDerivedStatus(await findQuoteInOrg(actor, String(req.params.id)));
    const job = await findJobInOrg(actor, q.jobId);
    return { q, job, input: { quote: await quoteDto(q), jobReference: job.reference, customerName: job.customer!.name, spaces: snapshotOf(q).spaces } };
  }
  r.get('/:id/pdf', params, async (req: Request, res: Response) => {
    const { q, job } = await exportInput(req);
    const pdf = await quotePdf(q, await linesOf(q), job, await loadCompanySettings(q.organisationId), deps.storage, null);
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${quoteFileName(q, 'pdf')}"`);
    res.send(pdf);
  });
  r.get('/:id/csv', params, async (req: Request, res: Response) => {
    const { q, input } = await exportInput(req);
    res.type('text/csv; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${quoteFileName(q, 'csv')}"`);
    res.send(quoteCsv(input));
  });
  r.get('/:id/xlsx', params, async (req: Request, res: Response) => {
    const { q, input } = await exportInput(req);
    res
      .type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet')
      .setHeader('Content-Disposition', `attachment; filename="${quoteFileName(q, 'xlsx')}"`);
    res.send(await quoteXlsx(input));
  });
  return r;
}

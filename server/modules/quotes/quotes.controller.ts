import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { QuoteFilesService } from './quote-files.service';
import type { QuoteSendService } from './quote-send.service';
import type { QuotesService } from './quotes.service';

/** The quote services a controller needs; built once in createApp. */
export interface QuoteServices {
  quotes: QuotesService;
  send: QuoteSendService;
  files: QuoteFilesService;
}

/** HTTP only: reads the validated request, calls the quote services, shapes the response. */
export function createQuotesController({ quotes, send, files }: QuoteServices) {
  return {
    async listForJob(req: Request, res: Response) {
      res.json({ quotes: await quotes.listForJob(currentUser(req), String(req.params.id)) });
    },
    async createFromJob(req: Request, res: Response) {
      res.status(201).json({ quote: await quotes.createFromJob(currentUser(req), String(req.params.id), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ quote: await quotes.get(currentUser(req), String(req.params.id)) });
    },
    async patch(req: Request, res: Response) {
      res.json({ quote: await quotes.patch(currentUser(req), String(req.params.id), req.body) });
    },
    async remove(req: Request, res: Response) {
      await quotes.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    },
    async send(req: Request, res: Response) {
      res.json(await send.send(currentUser(req), String(req.params.id), req.body));
    },
    async pdf(req: Request, res: Response) {
      const { filename, body } = await files.pdf(currentUser(req), String(req.params.id));
      res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
      res.send(body);
    },
    async csv(req: Request, res: Response) {
      const { filename, body } = await files.csv(currentUser(req), String(req.params.id));
      res.type('text/csv; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${filename}"`);
      res.send(body);
    },
    async xlsx(req: Request, res: Response) {
      const { filename, body } = await files.xlsx(currentUser(req), String(req.params.id));
      res.type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet').setHeader('Content-Disposition', `attachment; filename="${filename}"`);
      res.send(body);
    },
  };
}

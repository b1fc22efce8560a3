import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/require-auth';
import type { InvoicesService } from './invoices.service';

/** HTTP only: reads the validated request, calls the invoices service, shapes the response. */
export function createInvoicesController(service: InvoicesService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ invoices: await service.list(currentUser(req), req.query as never) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ invoice: await service.create(currentUser(req), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ invoice: await service.get(currentUser(req), String(req.params.id)) });
    },
    async update(req: Request, res: Response) {
      res.json({ invoice: await service.update(currentUser(req), String(req.params.id), req.body) });
    },
    async pdf(req: Request, res: Response) {
      const { filename, pdf } = await service.pdf(currentUser(req), String(req.params.id));
      res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${filename}"`);
      res.send(pdf);
    },
    async send(req: Request, res: Response) {
      res.json({ invoice: await service.send(currentUser(req), String(req.params.id)) });
    },
    async creditNote(req: Request, res: Response) {
      res.status(201).json({ creditNote: await service.creditNote(currentUser(req), String(req.params.id), req.body) });
    },
  };
}

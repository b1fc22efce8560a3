import type { Request, Response } from 'express';
import type { PublicQuoteService } from './public-quote.service';

/** HTTP only: reads the validated link token and body, calls the public quote service, shapes the response. */
export function createPublicQuoteController(service: PublicQuoteService) {
  const token = (req: Request) => String(req.params.token);
  return {
    async get(req: Request, res: Response) {
      res.json({ quote: await service.get(token(req)) });
    },
    async pdf(req: Request, res: Response) {
      const pdf = await service.pdf(token(req));
      res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${pdf.filename}"`);
      res.send(pdf.data);
    },
    async accept(req: Request, res: Response) {
      res.json({ quote: await service.accept(token(req), req.body, { ip: req.ip }) });
    },
    async decline(req: Request, res: Response) {
      res.json({ quote: await service.decline(token(req), req.body) });
    },
  };
}

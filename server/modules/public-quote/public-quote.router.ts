import { Router, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { acceptQuoteBodySchema, declineQuoteBodySchema } from '../../../shared/api/quotes';
import type { AppDeps } from '../../deps';
import { validate } from '../../middleware/validate';
import { createPublicQuoteService } from './public-quote.service';

const tokenParams = z.object({ token: z.string().min(10, { error: 'link token missing' }).max(500) });

/** /api/public/quotes/:token — no sign-in; the signed private link is the only key. */
export function publicQuoteRouter(deps: AppDeps) {
  const s = createPublicQuoteService(deps);
  const r = Router();
  r.use(
    rateLimit({
      windowMs: 15 * 60_000,
      limit: 300,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      message: { error: { code: 'rate_limited', message: 'too many requests; wait a few minutes' } },
    }),
  );
  r.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('Referrer-Policy', 'no-referrer');
    next();
  });
  r.get('/:token', validate({ params: tokenParams }), async (req: Request, res: Response) => {
    res.json({ quote: await s.get(String(req.params.token)) });
  });
  r.get('/:token/pdf', validate({ params: tokenParams }), async (req: Request, res: Response) => {
    const pdf = await s.pdf(String(req.params.token));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${pdf.filename}"`);
    res.send(pdf.data);
  });
  r.post('/:token/accept', validate({ params: tokenParams, body: acceptQuoteBodySchema }), async (req: Request, res: Response) => {
    res.json({ quote: await s.accept(String(req.params.token), req.body, { ip: req.ip }) });
  });
  r.post('/:token/decline', validate({ params: tokenParams, body: declineQuoteBodySchema }), async (req: Request, res: Response) => {
    res.json({ quote: await s.decline(String(req.params.token), req.body) });
  });
  return r;
}

import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { acceptQuoteBodySchema, declineQuoteBodySchema } from '../../../shared/api/quotes';
import { validate } from '../../middleware/validate';
import { createPublicQuoteController } from './public-quote.controller';
import type { PublicQuoteService } from './public-quote.service';

const tokenParams = z.object({ token: z.string().min(10, { error: 'link token missing' }).max(500) });

/** /api/public/quotes/:token — no sign-in; the signed private link is the only key. */
export function publicQuoteRouter(service: PublicQuoteService) {
  const c = createPublicQuoteController(service);
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
  r.get('/:token', validate({ params: tokenParams }), c.get);
  r.get('/:token/pdf', validate({ params: tokenParams }), c.pdf);
  r.post('/:token/accept', validate({ params: tokenParams, body: acceptQuoteBodySchema }), c.accept);
  r.post('/:token/decline', validate({ params: tokenParams, body: declineQuoteBodySchema }), c.decline);
  return r;
}

import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { AppDeps } from './deps';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { createSessionStack } from './middleware/session';
import { createAuthService } from './modules/auth/auth.service';
import { authRouter } from './modules/auth/auth.router';
import { customersRouter } from './modules/customers/customers.router';
import { devOutboxRouter } from './modules/dev-outbox/dev-outbox.router';
import { healthRouter } from './modules/health/health.router';
import { mountPayments, mountPaymentsWebhook } from './modules/payments/mount';
import { jobSheetRouter } from './modules/job-sheet/job-sheet.router';
import { jobsRouter } from './modules/jobs/jobs.router';
import { photosRouter } from './modules/photos/photos.router';
import { scheduleRouter } from './modules/schedule/schedule.router';
import { spacesRouter } from './modules/spaces/spaces.router';
import { plansRouter } from './modules/plans/plans.router';
import { usersRouter } from './modules/users/users.router';
import { catalogueRouter } from './modules/catalogue/catalogue.router';
import { publicQuoteRouter } from './modules/public-quote/public-quote.router';
import { jobQuotesRouter, quotesRouter } from './modules/quotes/quotes.router';
import { settingsRouter } from './modules/settings/settings.router';
import { jobSheetExportRouter } from './modules/exports/job-sheet-export.router';

/**
 * The Express app, with no listening and no global state: index.ts listens, tests use supertest.
 * Order: security headers → body parsing → session + passport → API routers → API 404 → SPA.
 */
export function createApp(deps: AppDeps): Express {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('query parser', 'extended');

  app.use(helmet());
  // The webhook verifies a signature over the raw body, so it sits before the JSON parser.
  mountPaymentsWebhook(app, deps);
  app.use(express.json({ limit: '5mb' }));

  const auth = createAuthService(deps);
  const { handlers: sessionHandlers, passport } = createSessionStack(deps, auth);

  // Health answers without a session (load balancers probe it).
  app.use('/api/health', healthRouter(deps));
  app.use('/api', ...sessionHandlers);
  app.use('/api/auth', authRouter(deps, auth, passport));
  app.use('/api/users', usersRouter(deps, auth));
  app.use('/api/customers', customersRouter(deps));
  app.use('/api/jobs', jobsRouter(deps));
  app.use('/api/spaces', spacesRouter(deps));
  if (!config.isProduction) app.use('/api/dev/outbox', devOutboxRouter(deps));

  mountPayments(app, deps); // /api/payments, /api/invoices, customer pages under /pay
  app.use('/api/schedule', scheduleRouter(deps)); // week view, booking, install settings
  app.use('/api', jobSheetRouter(deps)); // my-jobs, job sheet, ticks, notes, finish, handover
  app.use('/api', photosRouter(deps)); // site photos

  app.use('/api/settings', settingsRouter(deps)); // company settings, logo
  app.use('/api/catalogue', catalogueRouter(deps)); // products, extras, tax rates
  app.use('/api/jobs', jobQuotesRouter(deps)); // build and list a job's quotes
  app.use('/api/quotes', quotesRouter(deps)); // quotes, send, PDF/CSV/XLSX
  app.use('/api/public/quotes', publicQuoteRouter(deps)); // the customer's private link (no sign-in)
  app.use('/api/jobs', jobSheetExportRouter(deps)); // job sheet PDF and e-mailing it to the installer

  app.use('/api/spaces', plansRouter(deps)); // plan, revisions, restore, background underlay

  app.use('/api', apiNotFound);

  mountClient(app, config.distDir);
  app.use(errorHandler);
  return app;
}

/** Serves the built client from dist/, with index.html for every other GET (client-side routes). */
function mountClient(app: Express, distDir: string) {
  const indexHtml = path.join(distDir, 'index.html');
  app.use(express.static(distDir, { index: false, maxAge: '1h', setHeaders: noCacheForHtml }));
  app.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text/plain').send('The client is not built yet: run `npm run build` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}

function noCacheForHtml(res: express.Response, file: string) {
  if (file.endsWith('.html')) res.setHeader('Cache-Control', 'no-cache');
}

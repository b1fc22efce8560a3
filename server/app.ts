import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { AppDeps } from './deps';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { requestLog } from './middleware/request-log';
import { sameOrigin } from './middleware/same-origin';
import { createSessionStack } from './middleware/session';
import { createAuthService } from './modules/auth/auth.service';
import { actualsRouters } from './modules/actuals/actuals.router';
import { createActualsService } from './modules/actuals/actuals.service';
import { authRouter } from './modules/auth/auth.router';
import { catalogueRouter } from './modules/catalogue/catalogue.router';
import { createCatalogueService } from './modules/catalogue/catalogue.service';
import { customersRouter } from './modules/customers/customers.router';
import { devOutboxRouter } from './modules/dev-outbox/dev-outbox.router';
import { handoverRouter } from './modules/handover/handover.router';
import { createHandoverService } from './modules/handover/handover.service';
import { mailRouter } from './modules/mail/mail.router';
import { createMailService } from './modules/mail/mail.service';
import { healthRouter, readyRouter } from './modules/health/health.router';
import { invoicesRouter } from './modules/invoices/invoices.router';
import { createInvoicesService } from './modules/invoices/invoices.service';
import { createJobSheetExportService } from './modules/job-sheet/job-sheet-export.service';
import { jobSheetRouters } from './modules/job-sheet/job-sheet.router';
import { createJobSheetService } from './modules/job-sheet/job-sheet.service';
import { createSiteRecordsService } from './modules/job-sheet/site-records.service';
import { jobsRouter } from './modules/jobs/jobs.router';
import { payRouter } from './modules/payments/pay.router';
import { createPayService } from './modules/payments/pay.service';
import { paymentsRouter, paymentsWebhookRouter } from './modules/payments/payments.router';
import { createPaymentsService } from './modules/payments/payments.service';
import { photosRouters } from './modules/photos/photos.router';
import { createPhotosService } from './modules/photos/photos.service';
import { planReadWithSession } from './modules/plans/plan-read-session';
import { plansRouter } from './modules/plans/plans.router';
import { publicQuoteRouter } from './modules/public-quote/public-quote.router';
import { createPublicQuoteService } from './modules/public-quote/public-quote.service';
import { createQuoteFilesService } from './modules/quotes/quote-files.service';
import { createQuoteSendService } from './modules/quotes/quote-send.service';
import { jobQuotesRouter, quotesRouter } from './modules/quotes/quotes.router';
import { createQuotesService } from './modules/quotes/quotes.service';
import { scheduleRouter } from './modules/schedule/schedule.router';
import { createScheduleService } from './modules/schedule/schedule.service';
import { settingsRouter } from './modules/settings/settings.router';
import { createSettingsService } from './modules/settings/settings.service';
import { spacesRouters } from './modules/spaces/spaces.router';
import { usersRouter } from './modules/users/users.router';

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

  // While shutting down, each answer ends its connection so clients reconnect to another instance.
  app.use((_req, res, next) => {
    if (deps.lifecycle.draining) res.setHeader('Connection', 'close');
    next();
  });
  app.use(helmet());
  app.use(requestLog(deps.logger));
  // Services shared by several routers are built once here.
  const payments = createPaymentsService(deps);
  const invoices = createInvoicesService(deps, payments);
  const quotes = { quotes: createQuotesService(deps), send: createQuoteSendService(deps), files: createQuoteFilesService(deps) };
  // The webhook verifies a signature over the raw body, so it sits before the JSON parser.
  app.use('/api/payments/webhook', paymentsWebhookRouter(deps, payments));
  app.use(express.json({ limit: '5mb' }));

  const auth = createAuthService(deps);
  const { handlers: sessionHandlers, passport } = createSessionStack(deps, auth);
  const spaces = spacesRouters(deps);
  const photoService = createPhotosService(deps);
  const records = createSiteRecordsService(deps);
  const sheetService = createJobSheetService(records, photoService);
  const sheets = jobSheetRouters(deps, { sheets: sheetService, records, exports: createJobSheetExportService(deps, sheetService) });
  const photos = photosRouters(deps, photoService);
  const actuals = actualsRouters(createActualsService(deps));

  // Health answers without a session (load balancers probe it).
  app.use('/api/health', healthRouter(deps));
  app.use('/api/ready', readyRouter(deps)); // database, mail queue, not shutting down
  app.use('/api', sameOrigin(config.appUrl, ['/api/payments/webhook']));
  // The editor's plan read brings its session along in one statement; what it does not answer goes on.
  app.get('/api/spaces/:id/plan', planReadWithSession(deps.pool, config.sessionSecret));
  app.use('/api', ...sessionHandlers);
  app.use('/api/auth', authRouter(deps, auth, passport));
  app.use('/api/users', usersRouter(deps, auth));
  app.use('/api/customers', customersRouter(deps));
  // One router on /api/jobs; the other modules' routes about one job are composed into it.
  app.use(
    '/api/jobs',
    jobsRouter(deps, [
      spaces.jobSpaces,
      jobQuotesRouter(quotes),
      sheets.jobSheet,
      photos.jobPhotos,
      handoverRouter(deps, createHandoverService(deps)),
      actuals.job,
    ]),
  );
  app.use('/api/my-jobs', sheets.myJobs);
  // The plans router first: the editor's plan read is the busiest authenticated GET, and a router
  // that matches nothing hands the request on a turn of the event loop later (router's setImmediate).
  app.use('/api/spaces', plansRouter(deps)); // plan, revisions, restore, background underlay
  app.use('/api/spaces', spaces.spaces);
  app.use('/api/photos', photos.photos);
  app.use('/api/mail', mailRouter(createMailService(deps))); // e-mail status, resend a failed one
  app.use('/api/schedule', scheduleRouter(createScheduleService(deps))); // week view, booking, install settings
  app.use('/api/settings', settingsRouter(createSettingsService(deps.storage))); // company settings, logo
  app.use('/api/catalogue', catalogueRouter(createCatalogueService())); // products, extras, tax rates
  app.use('/api/quotes', quotesRouter(quotes)); // quotes, send, PDF/CSV/XLSX
  app.use('/api/public/quotes', publicQuoteRouter(createPublicQuoteService(deps))); // the customer's private link (no sign-in)
  app.use('/api/payments', paymentsRouter(deps, payments));
  app.use('/api/invoices', invoicesRouter(deps, invoices));
  app.use('/api/reports', actuals.reports); // estimate against actual, suggestions (office)
  app.use('/pay', payRouter(createPayService(deps, payments, invoices))); // the customer's payment pages (no sign-in)
  if (!config.isProduction) app.use('/api/dev/outbox', devOutboxRouter(deps));

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
  // The page and the service worker are re-checked on every visit, so a deploy reaches everyone.
  if (file.endsWith('.html') || path.basename(file) === 'sw.js' || file.endsWith('.webmanifest')) res.setHeader('Cache-Control', 'no-cache');
}

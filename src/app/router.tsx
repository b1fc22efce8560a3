import { lazy, Suspense, type ComponentType, type LazyExoticComponent } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { jobEventsQueryOptions } from '../features/jobs/api/get-job-events';
import { jobQueryOptions } from '../features/jobs/api/get-job';
import { LoadingState } from '../components/ui';
import { RouteErrorPage } from './error-boundary';
import { RequireAuth } from './require-auth';

/** Wraps a lazily loaded page so its chunk loads behind a spinner. */
function page(Component: LazyExoticComponent<ComponentType>) {
  return (
    <Suspense fallback={<LoadingState />}>
      <Component />
    </Suspense>
  );
}

// Every page is its own chunk: the entry stays small (sign-in too: its form brings zod and the form
// library, which a signed-in user's first screen does not need), and konva loads only on the editor's route.
const SignInPage = lazy(() => import('./routes/sign-in'));
const SetPasswordPage = lazy(() => import('./routes/set-password'));
const ResetPasswordPage = lazy(() => import('./routes/reset-password'));
const HomeRedirect = lazy(() => import('./routes/home-redirect'));
const JobsListPage = lazy(() => import('./routes/jobs-list'));
const JobNewPage = lazy(() => import('./routes/job-new'));
const JobDetailPage = lazy(() => import('./routes/job-detail'));
const JobEditPage = lazy(() => import('./routes/job-edit'));
const CustomersPage = lazy(() => import('./routes/customers'));
const UsersPage = lazy(() => import('./routes/users'));
const OutboxPage = lazy(() => import('./routes/outbox'));
const NotFoundPage = lazy(() => import('./routes/not-found'));

// Feature pages (site work, schedule, settings, quotes, the plan editor); each is its own lazy chunk.
const MyJobsPage = lazy(() => import('../features/job-sheet/components/my-jobs-page'));
const JobSheetPage = lazy(() => import('../features/job-sheet/components/job-sheet-page'));
const SchedulePage = lazy(() => import('../features/schedule/components/schedule-page'));
const SettingsPage = lazy(() => import('../features/settings/components/settings-page'));
const QuotePage = lazy(() => import('../features/quotes/components/quote-page'));
const PublicQuotePage = lazy(() => import('../features/quotes/components/public-quote-page')); // the customer's private link
const SpaceEditorPage = lazy(() => import('../editor/page/space-editor-page')); // Konva loads only here

// Money: invoices, payment settings
const InvoicesPage = lazy(() => import('../features/invoices/components/invoices-page'));
const ReportPage = lazy(() => import('../features/reports/components/report-page')); // recharts loads only here
const InvoicePage = lazy(() => import('../features/invoices/components/invoice-page'));
const PaymentSettingsPage = lazy(() => import('../features/invoices/components/payment-settings-page'));

/**
 * Starts a page's data request alongside its lazy chunk instead of after it. It does not wait
 * (navigation stays instant) and never throws: the page's own query shows loading and errors.
 */
function prefetchJob(queryClient: QueryClient | undefined) {
  return ({ params }: LoaderFunctionArgs) => {
    if (queryClient && params.id) {
      void queryClient.prefetchQuery(jobQueryOptions(params.id));
      void queryClient.prefetchQuery(jobEventsQueryOptions(params.id));
    }
    return null;
  };
}

/** Pages reachable only when signed in; they render inside the app frame (RequireAuth). */
const signedInRoutes = (queryClient?: QueryClient): RouteObject[] => [
  { index: true, element: page(HomeRedirect) },
  { path: 'jobs', element: page(JobsListPage) },
  { path: 'jobs/new', element: page(JobNewPage) },
  { path: 'jobs/:id', element: page(JobDetailPage), loader: prefetchJob(queryClient) },
  { path: 'jobs/:id/edit', element: page(JobEditPage), loader: prefetchJob(queryClient) },
  { path: 'customers', element: page(CustomersPage) },
  { path: 'users', element: page(UsersPage) },
  { path: 'outbox', element: page(OutboxPage) },

  // Feature pages (lazy-loaded)
  { path: 'my-jobs', element: page(MyJobsPage) },
  { path: 'jobs/:id/sheet', element: page(JobSheetPage) },
  { path: 'schedule', element: page(SchedulePage) },
  { path: 'settings', element: page(SettingsPage) },
  { path: 'jobs/:id/quotes/:quoteId', element: page(QuotePage) },
  { path: 'invoices', element: page(InvoicesPage) },
  { path: 'reports/estimate-vs-actual', element: page(ReportPage) },
  { path: 'invoices/:id', element: page(InvoicePage) },
  { path: 'settings/payments', element: page(PaymentSettingsPage) },
  // The editor takes the whole window below the header (see AppShell).
  { path: 'spaces/:id/edit', element: page(SpaceEditorPage), handle: { fullWidth: true } },
];

/** Pages anyone may open (signing in and the links in e-mails). */
const publicRoutes: RouteObject[] = [
  { path: '/sign-in', element: page(SignInPage) },
  { path: '/set-password', element: page(SetPasswordPage) },
  { path: '/reset-password', element: page(ResetPasswordPage) },
  { path: '/q/:token', element: page(PublicQuotePage) }, // no sign-in
];

/** The route table; `queryClient` lets routes start their data early (tests may leave it out). */
export function createRoutes(queryClient?: QueryClient): RouteObject[] {
  return [
    {
      errorElement: <RouteErrorPage />,
      children: [...publicRoutes, { path: '/', element: <RequireAuth />, children: signedInRoutes(queryClient) }, { path: '*', element: page(NotFoundPage) }],
    },
  ];
}

export function createAppRouter(queryClient?: QueryClient) {
  return createBrowserRouter(createRoutes(queryClient));
}

import { QueryClient } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactElement } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { vi } from 'vitest';
import type { Me } from '../../shared/api/auth';
import type { Role } from '../../shared/auth/roles';
import { AppProviders } from '../../src/app/providers';
import { authKeys } from '../../src/features/auth/api/get-me';

export function demoUser(role: Role): Me {
  return {
    id: `00000000-0000-4000-8000-00000000000${role === 'office' ? 1 : role === 'estimator' ? 2 : 3}`,
    email: `${role}@demo.example.com`,
    name: { office: 'Olive Office', estimator: 'Ezra Estimator', installer: 'Ivy Installer' }[role],
    role,
    organisation: { id: 'org-1', name: 'Hearthfield Insulation' },
  };
}

export type FakeCall = { method: string; url: URL; body: unknown };
type Handler = (call: FakeCall) => { status?: number; body?: unknown } | undefined;

/**
 * Replaces fetch with a fake API: `handler` answers each call (undefined → 404 JSON error).
 * Returns the list of calls so tests can check what the client asked for.
 */
export function fakeApi(handler: Handler): FakeCall[] {
  const calls: FakeCall[] = [];
  vi.stubGlobal('fetch', async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://quiltline.test');
    const call = { method: init.method ?? 'GET', url, body: init.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    const answer = handler(call) ?? { status: 404, body: { error: { code: 'not_found', message: 'no such route' } } };
    const status = answer.status ?? 200;
    return new Response(status === 204 ? null : JSON.stringify(answer.body ?? {}), {
      status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  return calls;
}

/** Renders routes in memory with a fresh query cache; `user` pre-loads the signed-in user. */
export function renderRoutes(routes: RouteObject[], opts: { path: string; user?: Me | null; queryClient?: QueryClient }) {
  const queryClient = opts.queryClient ?? new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });
  if (opts.user !== undefined) queryClient.setQueryData(authKeys.me(), opts.user);
  const router = createMemoryRouter(routes, { initialEntries: [opts.path] });
  const utils = render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { ...utils, router, queryClient };
}

export function renderPage(element: ReactElement, opts: { path?: string; routePath?: string; user?: Me | null } = {}) {
  return renderRoutes([{ path: opts.routePath ?? '*', element }], { path: opts.path ?? '/', user: opts.user });
}

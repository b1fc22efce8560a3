import { Component, type ErrorInfo, type ReactNode } from 'react';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';

function Crash({ message }: { message: string }) {
  return (
    <div className="notebook-paper flex min-h-dvh flex-col items-center justify-center px-4 text-center">
      <h1 className="text-xl font-semibold">Something went wrong on this page</h1>
      <p className="mt-2 max-w-md text-sm text-graphite-light">{message}</p>
      <div className="mt-5 flex gap-2">
        <button className="rounded-md bg-teal-dark px-4 py-2 text-sm font-medium text-white" onClick={() => window.location.reload()}>
          Reload
        </button>
        <a className="rounded-md border border-graphite/25 px-4 py-2 text-sm font-medium" href="/">
          Start page
        </a>
      </div>
    </div>
  );
}

/** Last line of defence around the whole app: a render error shows a message, not a blank page. */
export class AppErrorBoundary extends Component<{ children: ReactNode }, { error: Error | null }> {
  state = { error: null as Error | null };
  static getDerivedStateFromError(error: Error) {
    return { error };
  }
  componentDidCatch(error: Error, info: ErrorInfo) {
    console.error('Quiltline crashed', error, info.componentStack);
  }
  render() {
    return this.state.error ? <Crash message={this.state.error.message} /> : this.props.children;
  }
}

/** The router's errorElement: render errors and failed lazy chunks (after a deploy, a reload fixes them). */
export function RouteErrorPage() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? /dynamically imported module|Failed to fetch/i.test(error.message)
        ? 'A newer version of Quiltline is available. Reload the page to get it.'
        : error.message
      : 'Unknown error';
  return <Crash message={message} />;
}

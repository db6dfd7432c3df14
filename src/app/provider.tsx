import { Component, type ErrorInfo, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { setUnauthorizedHandler } from '@/lib/api-client';
import { handleSessionEnded } from '@/lib/auth';
import { queryClient } from '@/lib/query-client';

// Any 401 outside sign-in means the session is gone: forget the user, and the route guard
// sends them to sign in with ?next= pointing back here.
setUnauthorizedHandler(() => handleSessionEnded(queryClient));

class AppErrorBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  state = { failed: false };

  static getDerivedStateFromError() {
    return { failed: true };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    console.error('Headroom crashed', error, info.componentStack);
  }

  render() {
    if (!this.state.failed) return this.props.children;
    return (
      <div role="alert" className="mx-auto max-w-md px-4 py-16 text-center">
        <h1 className="text-2xl font-bold">Headroom hit a problem</h1>
        <p className="mt-2 text-ink-2">Reload the page to carry on.</p>
        <button
          type="button"
          className="mt-5 min-h-11 rounded-md bg-accent-600 px-4 font-semibold text-white"
          onClick={() => window.location.reload()}
        >
          Reload the page
        </button>
      </div>
    );
  }
}

export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <AppErrorBoundary>
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </AppErrorBoundary>
  );
}

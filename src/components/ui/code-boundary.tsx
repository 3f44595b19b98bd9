import { Component, lazy, type ComponentType, type ErrorInfo, type ReactNode } from 'react';
import { Button } from './button';

/** Whether an error is a chunk of the app's code that could not be fetched (no signal), rather than a fault. */
export function isCodeLoadError(error: unknown): boolean {
  if (!(error instanceof Error)) return false;
  return /dynamically imported module|importing a module script failed|unable to preload|error loading dynamically imported/i.test(error.message);
}

/** A lazily loaded component that can be asked again after its code failed to arrive (React.lazy keeps a failure). */
export type RetryableLazy<P> = ComponentType<P> & { retry: () => void };

/** `React.lazy` whose failed load can be tried again (`retry()`), for parts of a page that must work offline. */
export function retryableLazy<P extends object>(load: () => Promise<ComponentType<P>>): RetryableLazy<P> {
  const make = () => lazy(async () => ({ default: await load() }));
  let Current = make();
  const Part = ((props: P) => <Current {...props} />) as RetryableLazy<P>;
  Part.retry = () => {
    Current = make();
  };
  return Part;
}

interface Props {
  /** What could not load, as the person knows it: "The Mark done form". */
  what: string;
  /** Called before trying again (e.g. the lazy parts' `retry`). */
  onRetry: () => void;
  children: ReactNode;
}

/**
 * Around a lazily loaded part of a page: when its code cannot be fetched (no signal before it had
 * arrived), says so in words and tries again with the signal or a tap — never a blank or a crash.
 * Other errors go on to the page's own error handling.
 */
export class CodeBoundary extends Component<Props, { error: unknown }> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  componentDidCatch(error: unknown, info: ErrorInfo) {
    if (!isCodeLoadError(error)) console.error(error, info.componentStack);
  }

  componentDidMount() {
    window.addEventListener('online', this.retry);
  }

  componentWillUnmount() {
    window.removeEventListener('online', this.retry);
  }

  retry = () => {
    if (!this.state.error) return;
    this.props.onRetry();
    this.setState({ error: null });
  };

  render() {
    const { error } = this.state;
    if (!error) return this.props.children;
    if (!isCodeLoadError(error)) throw error;
    return (
      <div role="alert" className="flex flex-col gap-2 rounded-md border border-ochre bg-ochre/10 px-4 py-3 text-sm">
        <p>
          <span className="font-semibold">{this.props.what} has not reached this phone yet, and there is no signal to fetch it.</span> Nothing is lost: it opens by itself when the phone is back online.
        </p>
        <Button variant="secondary" className="self-start" onClick={this.retry}>
          Try again
        </Button>
      </div>
    );
  }
}

import { Component, type ErrorInfo, type ReactNode } from "react";

/** Shows `fallback` instead of a crashed subtree (e.g. a chart chunk that failed to load). */
export class ErrorBoundary extends Component<{ fallback: (error: Error) => ReactNode; children: ReactNode }, { error: Error | null }> {
  override state: { error: Error | null } = { error: null };

  static getDerivedStateFromError(error: Error) {
    return { error };
  }

  override componentDidCatch(error: Error, info: ErrorInfo) {
    console.error("A part of the page failed to draw", error, info.componentStack);
  }

  override render() {
    return this.state.error ? this.props.fallback(this.state.error) : this.props.children;
  }
}

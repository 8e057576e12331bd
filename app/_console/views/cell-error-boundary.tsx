"use client";
/// Keeps one cell's rendering failure inside that cell. Values come from stored sessions
/// and imports, which only check a value's outer shape; a value the drawing code does not
/// expect (a list where a number belongs, say) must not take the page down, so each cell
/// is drawn inside its own boundary, which shows the source and says what went wrong.
import { Component, type ReactNode } from "react";

interface Props {
  position: number;
  source: string;
  children: ReactNode;
}

export class CellErrorBoundary extends Component<Props, { error: Error | null }> {
  state: { error: Error | null } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error: error instanceof Error ? error : new Error(String(error)) };
  }

  componentDidCatch(error: unknown) {
    console.error(`[ringside] cell ${this.props.position + 1} could not be drawn:`, error);
  }

  render() {
    const { error } = this.state;
    if (!error) return this.props.children;
    return (
      <article className="space-y-1 border-b border-ink/10 py-3 dark:border-paper/10" data-testid="cell-render-error">
        <div className="text-xs font-mono text-ink/50 dark:text-paper/50">[{this.props.position + 1}]</div>
        <pre className="whitespace-pre-wrap font-mono text-sm text-ink dark:text-paper">{this.props.source}</pre>
        <p role="alert" className="rounded bg-red-100 px-2 py-1 text-sm text-red-800 dark:bg-red-900/50 dark:text-red-200">
          This cell holds a value the console cannot draw ({error.message.slice(0, 200)}); the rest of the session is unaffected.
        </p>
      </article>
    );
  }
}

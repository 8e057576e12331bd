/// What a computation has streamed so far — finished statements and the partial results of the
/// running one (Betti columns of a resolution, items of a comprehension) — kept by whoever
/// runs it, so that a cancel, a limit or a lost server still stores the work done and says
/// where it stopped ("stopped after homological degree 6").
import type { ValueJson } from "../wire/values";
import type { CellEvent, Span } from "./cell-events";

type BettiEntry = readonly [number, number, number];

export interface StatementResult {
  statement: number;
  span: Span;
  value: ValueJson;
}

export class StreamedWork {
  readonly results: StatementResult[] = [];
  spans: Span[] = [];
  private partialStatement: number | null = null;
  private betti = new Map<string, BettiEntry>();
  private items: ValueJson[] = [];
  private version = 0;
  private savedVersion = -1;

  /// Folds one event in (call it for every event, in order).
  observe(event: CellEvent): void {
    switch (event.event) {
      case "checked":
        this.spans = event.spans;
        return;
      case "result":
        this.results.push({ statement: event.statement, span: event.span, value: event.value });
        if (this.partialStatement === event.statement) this.clearPartial();
        this.version++;
        return;
      case "partial": {
        if (this.partialStatement !== event.statement) this.clearPartial();
        this.partialStatement = event.statement;
        const v = event.value as { type?: string; entries?: BettiEntry[] } | null;
        if (v?.type === "BettiTable" && Array.isArray(v.entries)) for (const e of v.entries) this.betti.set(`${e[0]},${e[1]}`, e);
        else this.items.push(event.value);
        this.version++;
        return;
      }
      default:
        return;
    }
  }

  private clearPartial(): void {
    this.partialStatement = null;
    this.betti = new Map();
    this.items = [];
  }

  /// "homological degree 6" (last Betti column streamed), "4 items", or null when the
  /// running statement streamed nothing.
  progress(): string | null {
    if (this.betti.size > 0) return `homological degree ${Math.max(...[...this.betti.values()].map((e) => e[0]))}`;
    if (this.items.length > 0) return `${this.items.length} item${this.items.length === 1 ? "" : "s"}`;
    return null;
  }

  /// The running statement's partial results as one value marked incomplete, or null.
  partialResult(why: string): StatementResult | null {
    const statement = this.partialStatement;
    if (statement === null) return null;
    const span = this.spans[statement] ?? this.results.at(-1)?.span ?? { from: { line: 1, col: 1 }, to: { line: 1, col: 1 } };
    const note = `stopped after ${this.progress()}: ${why}`;
    if (this.betti.size > 0) {
      const entries = [...this.betti.values()].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
      // The text follows the notation's Betti table text (lib/notation/text.ts).
      const text = `Betti numbers ${entries.map(([i, j, n]) => `β(${i},${j})=${n}`).join(", ")} (truncated: ${note})`;
      return {
        statement,
        span,
        value: {
          type: "BettiTable",
          text,
          entries: entries.map((e) => [e[0], e[1], e[2]] as [number, number, number]),
          complete: false,
          note,
        },
      };
    }
    // (a List's encoding has no note field; its text says it is partial)
    return {
      statement,
      span,
      value: { type: "List", text: `${this.items.length} items so far (${note})`, items: this.items } as ValueJson,
    };
  }

  /// The statements finished, with the running one's partial results, and where it stopped.
  stored(why: string): { statements: StatementResult[]; stopped: string; progress: string | null } {
    const partial = this.partialResult(why);
    const progress = this.progress();
    return {
      statements: partial ? [...this.results, partial] : [...this.results],
      stopped: `stopped ${progress ? `after ${progress}` : this.where()}: ${why}`,
      progress,
    };
  }

  /// For the heartbeat: what to write while running (no `currentRing`: a later cell must not
  /// take its ring from a cell that has not finished), or null when nothing changed since.
  snapshot(): { statements: StatementResult[]; progress: string | null } | null {
    if (this.version === this.savedVersion) return null;
    this.savedVersion = this.version;
    const partial = this.partialResult("the cell was still running when this was saved");
    return { statements: partial ? [...this.results, partial] : [...this.results], progress: this.progress() };
  }

  private where(): string {
    const n = this.spans.length;
    const at = this.results.length;
    return n > 0 && at < n ? `in statement ${at + 1} of ${n}` : "before it finished";
  }
}

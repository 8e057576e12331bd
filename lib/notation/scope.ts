/// Lexical scopes of evaluation: lambda parameters and comprehension variables shadow
/// the ring's variables and the session bindings (the checker's lookup order).
import type { Value } from "./values";

export class Scope {
  private constructor(
    private readonly vars: ReadonlyMap<string, Value>,
    private readonly parent: Scope | null,
  ) {}

  static readonly EMPTY = new Scope(new Map(), null);

  with(entries: Iterable<[string, Value]>): Scope {
    return new Scope(new Map(entries), this);
  }

  lookup(name: string): Value | undefined {
    const own = this.vars.get(name);
    if (own !== undefined) return own;
    return this.parent?.lookup(name);
  }
}

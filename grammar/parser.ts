/// The notation's parser (Chevrotain, embedded actions): tokens of one statement at a
/// time (see `layout`) to AST nodes with spans. Precedence, loosest first, is in
/// grammar/README.md; the rule names below follow it.
import { LIMIT_TABLE } from "../lib/limits";
import {
  EmbeddedActionsParser,
  EOF,
  type IParserErrorMessageProvider,
  type IRecognitionException,
  type IToken,
  type TokenType,
} from "chevrotain";
import type * as A from "./ast";
import type { Diagnostic } from "./analysis";
import { ALL_TOKENS, ENDS_OPERAND, layout, lexRaw, Tok } from "./lexer";
import { makeLocator, type Locator } from "./positions";

const OPERAND_START = new Set<TokenType>([
  Tok.Identifier,
  Tok.Integer,
  Tok.Str,
  Tok.True,
  Tok.False,
  Tok.LParen,
  Tok.LBracket,
  Tok.LBrace,
  Tok.IdealOpen,
]);

/// How a token is named in a message.
function describeToken(t: IToken | undefined): string {
  if (!t || t.tokenType === EOF || t.tokenType === Tok.End) return "the end of the statement";
  if (t.image === "") return `\`${t.tokenType.LABEL?.replace(/`/g, "") ?? t.tokenType.name}\``;
  if (t.tokenType === Tok.IdealOpen) return "`<`";
  if (t.tokenType === Tok.IdealClose) return "`>`";
  return `\`${t.image}\``;
}

const label = (t: TokenType): string => t.LABEL ?? t.name;

const RULE_WANTS: Record<string, string> = {
  primary: "an expression",
  expression: "an expression",
  powerExpr: "an expression",
  operatorChain: "an expression",
  exponent: "an expression",
  postfixExpr: "an expression",
  statement: "a statement",
  argument: "an argument",
  namedOption: "an option `name = value`",
};

const messages: IParserErrorMessageProvider = {
  buildMismatchTokenMessage: ({ expected, actual }) => `expected ${label(expected)}, found ${describeToken(actual)}`,
  buildNotAllInputParsedMessage: ({ firstRedundant }) =>
    `expected an operator or the end of the statement, found ${describeToken(firstRedundant)}`,
  buildNoViableAltMessage: ({ expectedPathsPerAlt, actual, ruleName }) => {
    const wants =
      RULE_WANTS[ruleName] ?? [...new Set(expectedPathsPerAlt.flatMap((alt) => alt.map((path) => label(path[0]))))].join(" or ");
    return `expected ${wants}, found ${describeToken(actual[0])}`;
  },
  buildEarlyExitMessage: ({ expectedIterationPaths, actual, ruleName }) => {
    const wants = RULE_WANTS[ruleName] ?? [...new Set(expectedIterationPaths.map((path) => label(path[0])))].join(" or ");
    return `expected ${wants}, found ${describeToken(actual[0])}`;
  },
};

type ChainItem = { operand: A.Expr } | { prefix: IToken } | { binary: IToken };

const NOT_PREC = 4;
const COMPARE_PREC = 5;
const RANGE_PREC = 6;
const NEG_PREC = 10;
/// Binding strength of the binary operators (the precedence table in README.md).
const PRECEDENCE = new Map<TokenType, number>([
  [Tok.Or, 2],
  [Tok.And, 3],
  [Tok.EqEq, COMPARE_PREC],
  [Tok.NotEq, COMPARE_PREC],
  [Tok.Lt, COMPARE_PREC],
  [Tok.LessEq, COMPARE_PREC],
  [Tok.Gt, COMPARE_PREC],
  [Tok.GreaterEq, COMPARE_PREC],
  [Tok.In, COMPARE_PREC],
  [Tok.MemberOf, COMPARE_PREC],
  [Tok.DotDot, RANGE_PREC],
  [Tok.Amp, 7],
  [Tok.Colon, 7],
  [Tok.Plus, 8],
  [Tok.Minus, 8],
  [Tok.Star, 9],
  [Tok.Slash, 9],
]);
const BINARY_TOKENS = [...PRECEDENCE.keys()];

const BINARY_OPS = new Map<TokenType, A.BinaryOp>([
  [Tok.Plus, "+"],
  [Tok.Minus, "-"],
  [Tok.Star, "*"],
  [Tok.Slash, "/"],
  [Tok.Caret, "^"],
  [Tok.Amp, "&"],
  [Tok.Colon, ":"],
  [Tok.EqEq, "=="],
  [Tok.NotEq, "!="],
  [Tok.Lt, "<"],
  [Tok.LessEq, "<="],
  [Tok.Gt, ">"],
  [Tok.GreaterEq, ">="],
  [Tok.In, "in"],
  [Tok.MemberOf, "in"],
  [Tok.And, "and"],
  [Tok.Or, "or"],
]);

function unescape(image: string): string {
  return image.slice(1, -1).replace(/\\(.)/g, "$1");
}

class NotationParser extends EmbeddedActionsParser {
  private loc: Locator = makeLocator("");
  /// Errors found by the actions themselves (e.g. a lambda parameter that is no name).
  extra: { message: string; span: A.Span }[] = [];

  constructor() {
    super(ALL_TOKENS, { recoveryEnabled: true, maxLookahead: 3, errorMessageProvider: messages });
    this.performSelfAnalysis();
  }

  load(loc: Locator, tokens: IToken[]): void {
    this.loc = loc;
    this.extra = [];
    this.input = tokens;
  }

  // ---- spans ---------------------------------------------------------------------

  private tokSpan(t: IToken): A.Span {
    const start = Number.isFinite(t.startOffset) ? t.startOffset : this.lastEnd();
    return { from: this.loc.at(start), to: this.loc.at(start + (t.image?.length ?? 0)) };
  }

  private lastEnd(): number {
    const t = this.LA(0);
    return t && Number.isFinite(t.endOffset) ? (t.endOffset as number) + 1 : 0;
  }

  /// From a start span to the end of the last consumed token.
  private spanFrom(start: A.Span): A.Span {
    const end = this.lastEnd();
    const to = this.loc.at(Math.max(end, start.to.offset));
    return { from: start.from, to };
  }

  private errorHere(): A.ErrorExpr {
    const at = this.LA(1);
    const off = at && Number.isFinite(at.startOffset) && at.tokenType !== EOF ? at.startOffset : this.lastEnd();
    const p = this.loc.at(off);
    return { kind: "ErrorExpr", span: { from: p, to: p } };
  }

  private name(t: IToken): A.Name {
    return { kind: "Name", name: t.image, span: this.tokSpan(t) };
  }

  private bin(op: A.BinaryOp, left: A.Expr, right: A.Expr, opTok: IToken): A.Binary {
    return {
      kind: "Binary",
      op,
      left,
      right,
      opSpan: this.tokSpan(opTok),
      span: { from: left.span.from, to: right.span.to },
    };
  }

  private readonly recover = { recoveryValueFunc: () => this.errorHere() };

  // ---- statements ----------------------------------------------------------------

  statement = this.RULE(
    "statement",
    (): A.Statement =>
      this.OR([
        {
          ALT: () => {
            const id = this.CONSUME(Tok.Identifier);
            this.CONSUME(Tok.Define);
            const value = this.SUBRULE(this.expression);
            return this.ACTION(() => {
              const name = this.name(id);
              return { kind: "Define", name, value, span: this.spanFrom(name.span) } as A.Define;
            });
          },
        },
        {
          ALT: () => {
            const u = this.CONSUME(Tok.Use);
            const id = this.CONSUME2(Tok.Identifier);
            return this.ACTION(() => ({ kind: "Use", name: this.name(id), span: this.spanFrom(this.tokSpan(u)) }) as A.Use);
          },
        },
        {
          ALT: () => {
            const expr = this.SUBRULE2(this.expression);
            return this.ACTION(() => ({ kind: "ExprStatement", expr, span: expr.span }) as A.ExprStatement);
          },
        },
      ]),
    {
      recoveryValueFunc: () => {
        const e = this.errorHere();
        return { kind: "ExprStatement", expr: e, span: e.span } as A.Statement;
      },
    },
  );

  // ---- expressions, loosest first ------------------------------------------------

  expression = this.RULE(
    "expression",
    (): A.Expr =>
      this.OR([
        {
          ALT: () => {
            const start = this.CONSUME(Tok.If);
            const cond = this.SUBRULE(this.expression);
            this.CONSUME(Tok.Then);
            const then = this.SUBRULE2(this.expression);
            this.CONSUME(Tok.Else);
            const otherwise = this.SUBRULE3(this.expression);
            return this.ACTION(
              () =>
                ({
                  kind: "If",
                  cond,
                  then,
                  else: otherwise,
                  span: { from: this.tokSpan(start).from, to: otherwise.span.to },
                }) as A.If,
            );
          },
        },
        {
          ALT: () => {
            const lhs = this.SUBRULE(this.operatorChain);
            const body = this.OPTION(() => {
              this.CONSUME(Tok.Arrow);
              return this.SUBRULE4(this.expression);
            });
            return this.ACTION(() => (body === undefined ? lhs : this.lambda(lhs, body)));
          },
        },
      ]),
    this.recover,
  );

  private lambda(lhs: A.Expr, body: A.Expr): A.Lambda {
    const items = lhs.kind === "Tuple" ? lhs.items : [lhs];
    const params: A.Name[] = [];
    for (const item of items) {
      if (item.kind === "Identifier") params.push({ kind: "Name", name: item.name, span: item.span });
      else if (item.kind !== "ErrorExpr")
        this.extra.push({
          message: "a function's parameters must be names, as in `I -> S / I` or `(a, b) -> a + b`",
          span: item.span,
        });
    }
    return { kind: "Lambda", params, body, span: { from: lhs.span.from, to: body.span.to } };
  }

  /// Levels 2–10 of the precedence table (or … unary minus) in one flat rule: operands
  /// (powers) with prefix and binary operators between them, arranged into a tree by
  /// precedence in `arrange`. One rule instead of nine keeps parsing fast.
  operatorChain = this.RULE(
    "operatorChain",
    (): A.Expr => {
      const items: ChainItem[] = [];
      this.MANY(() => {
        const t = this.OR([{ ALT: () => this.CONSUME(Tok.Not) }, { ALT: () => this.CONSUME(Tok.Minus) }]);
        this.ACTION(() => items.push({ prefix: t }));
      });
      const first = this.SUBRULE(this.powerExpr);
      this.ACTION(() => items.push({ operand: first }));
      this.MANY2(() => {
        const op = this.OR2(BINARY_TOKENS.map((t) => ({ ALT: () => this.CONSUME2(t) })));
        this.ACTION(() => items.push({ binary: op }));
        this.MANY3(() => {
          const t = this.OR3([{ ALT: () => this.CONSUME3(Tok.Not) }, { ALT: () => this.CONSUME3(Tok.Minus) }]);
          this.ACTION(() => items.push({ prefix: t }));
        });
        const next = this.SUBRULE2(this.powerExpr);
        this.ACTION(() => items.push({ operand: next }));
      });
      return this.ACTION(() => this.arrange(items));
    },
    this.recover,
  );

  /// Operator precedence (shunting-yard) over a chain; all binary operators associate
  /// to the left, except that comparisons and ranges do not chain (reported).
  private arrange(items: ChainItem[]): A.Expr {
    const out: A.Expr[] = [];
    const ops: { tok: IToken; prec: number; prefix: boolean }[] = [];
    const reduce = () => {
      const op = ops.pop()!;
      if (op.prefix) {
        const operand = out.pop() ?? this.errorHere();
        out.push({
          kind: "Unary",
          op: op.tok.tokenType === Tok.Not ? "not" : "-",
          operand,
          span: { from: this.tokSpan(op.tok).from, to: operand.span.to },
        });
        return;
      }
      const right = out.pop() ?? this.errorHere();
      const left = out.pop() ?? this.errorHere();
      if (op.tok.tokenType === Tok.DotDot) {
        out.push({ kind: "Range", from: left, to: right, span: { from: left.span.from, to: right.span.to } });
      } else out.push(this.bin(BINARY_OPS.get(op.tok.tokenType)!, left, right, op.tok));
    };
    for (const item of items) {
      if ("operand" in item) out.push(item.operand);
      else if ("prefix" in item) {
        ops.push({ tok: item.prefix, prec: item.prefix.tokenType === Tok.Not ? NOT_PREC : NEG_PREC, prefix: true });
      } else {
        const prec = PRECEDENCE.get(item.binary.tokenType)!;
        while (ops.length > 0 && ops[ops.length - 1].prec >= prec) {
          const top = ops[ops.length - 1];
          if (!top.prefix && top.prec === prec && (prec === COMPARE_PREC || prec === RANGE_PREC)) {
            this.extra.push({
              message:
                prec === COMPARE_PREC
                  ? "comparisons do not chain: join them with `and`, as in a < b and b < c"
                  : "ranges do not chain: write a..b",
              span: this.tokSpan(item.binary),
            });
          }
          reduce();
        }
        ops.push({ tok: item.binary, prec, prefix: false });
      }
    }
    while (ops.length > 0) reduce();
    return out[0] ?? this.errorHere();
  }

  /// `^` binds tighter than unary minus on its left and is right-associative; its
  /// exponent may carry a sign so that `x^-1` parses and gets a clear type error.
  powerExpr = this.RULE(
    "powerExpr",
    (): A.Expr => {
      let base = this.SUBRULE(this.postfixExpr);
      this.OPTION(() => {
        const op = this.CONSUME(Tok.Caret);
        const exponent = this.SUBRULE(this.exponent);
        base = this.ACTION(() => this.bin("^", base, exponent, op));
      });
      return base;
    },
    this.recover,
  );

  /// The right side of `^`: a power (right-associative), optionally negated.
  exponent = this.RULE(
    "exponent",
    (): A.Expr =>
      this.OR([
        {
          ALT: () => {
            const op = this.CONSUME(Tok.Minus);
            const operand = this.SUBRULE(this.exponent);
            return this.ACTION(
              () =>
                ({
                  kind: "Unary",
                  op: "-",
                  operand,
                  span: { from: this.tokSpan(op).from, to: operand.span.to },
                }) as A.Unary,
            );
          },
        },
        { ALT: () => this.SUBRULE(this.powerExpr) },
      ]),
    this.recover,
  );

  postfixExpr = this.RULE(
    "postfixExpr",
    (): A.Expr => {
      let e = this.SUBRULE(this.primary);
      this.MANY(() => {
        this.OR([
          {
            ALT: () => {
              this.CONSUME(Tok.Dot);
              const id = this.CONSUME(Tok.Identifier);
              e = this.ACTION(() => ({ kind: "Property", object: e, name: this.name(id), span: this.spanFrom(e.span) }) as A.Property);
            },
          },
          {
            ALT: () => {
              this.CONSUME(Tok.LParen);
              const args: A.Expr[] = [];
              const named: A.NamedArg[] = [];
              this.MANY_SEP({
                SEP: Tok.Comma,
                DEF: () => {
                  const a = this.SUBRULE(this.argument);
                  this.ACTION(() => (a.kind === "NamedArg" ? named.push(a) : args.push(a)));
                },
              });
              this.CONSUME(Tok.RParen);
              e = this.ACTION(() => ({ kind: "Call", callee: e, args, named, span: this.spanFrom(e.span) }) as A.Call);
            },
          },
          {
            ALT: () => {
              this.CONSUME(Tok.LBracket);
              const items: A.Expr[] = [];
              const options: A.NamedArg[] = [];
              this.MANY_SEP2({
                SEP: Tok.Comma,
                DEF: () => {
                  const x = this.SUBRULE(this.expression);
                  this.ACTION(() => items.push(x));
                },
              });
              this.OPTION(() => {
                this.CONSUME(Tok.Semicolon);
                this.AT_LEAST_ONE_SEP2({
                  SEP: Tok.Comma,
                  DEF: () => {
                    const o = this.SUBRULE(this.namedOption);
                    this.ACTION(() => options.push(o));
                  },
                });
              });
              this.CONSUME(Tok.RBracket);
              e = this.ACTION(() => ({ kind: "Subscript", object: e, items, options, span: this.spanFrom(e.span) }) as A.Subscript);
            },
          },
        ]);
      });
      return e;
    },
    this.recover,
  );

  argument = this.RULE(
    "argument",
    (): A.Expr | A.NamedArg => this.OR([{ ALT: () => this.SUBRULE(this.namedOption) }, { ALT: () => this.SUBRULE(this.expression) }]),
    this.recover,
  );

  namedOption = this.RULE(
    "namedOption",
    (): A.NamedArg => {
      const id = this.CONSUME(Tok.Identifier);
      this.CONSUME(Tok.Equals);
      const value = this.SUBRULE(this.expression);
      return this.ACTION(() => {
        const name = this.name(id);
        return { kind: "NamedArg", name, value, span: { from: name.span.from, to: value.span.to } } as A.NamedArg;
      });
    },
    {
      recoveryValueFunc: () => {
        const e = this.errorHere();
        return { kind: "NamedArg", name: { kind: "Name", name: "", span: e.span }, value: e, span: e.span } as A.NamedArg;
      },
    },
  );

  primary = this.RULE(
    "primary",
    (): A.Expr =>
      this.OR([
        {
          ALT: () => {
            const t = this.CONSUME(Tok.Integer);
            return this.ACTION(() => ({ kind: "IntLit", value: BigInt(t.image || "0"), span: this.tokSpan(t) }) as A.IntLit);
          },
        },
        {
          ALT: () => {
            const t = this.CONSUME(Tok.Str);
            return this.ACTION(() => ({ kind: "StrLit", value: unescape(t.image), span: this.tokSpan(t) }) as A.StrLit);
          },
        },
        {
          ALT: () => {
            const t = this.CONSUME(Tok.True);
            return this.ACTION(() => ({ kind: "BoolLit", value: true, span: this.tokSpan(t) }) as A.BoolLit);
          },
        },
        {
          ALT: () => {
            const t = this.CONSUME(Tok.False);
            return this.ACTION(() => ({ kind: "BoolLit", value: false, span: this.tokSpan(t) }) as A.BoolLit);
          },
        },
        {
          ALT: () => {
            const t = this.CONSUME(Tok.Identifier);
            return this.ACTION(() => ({ kind: "Identifier", name: t.image, span: this.tokSpan(t) }) as A.Identifier);
          },
        },
        { ALT: () => this.SUBRULE(this.parenthesized) },
        { ALT: () => this.SUBRULE(this.bracketed) },
        { ALT: () => this.SUBRULE(this.record) },
        { ALT: () => this.SUBRULE(this.idealLiteral) },
      ]),
    this.recover,
  );

  /// `(e)`, a tuple `(a, b)` or `()` (lambda parameters only).
  parenthesized = this.RULE(
    "parenthesized",
    (): A.Expr => {
      const open = this.CONSUME(Tok.LParen);
      const items: A.Expr[] = [];
      this.MANY_SEP({
        SEP: Tok.Comma,
        DEF: () => {
          const x = this.SUBRULE(this.expression);
          this.ACTION(() => items.push(x));
        },
      });
      this.CONSUME(Tok.RParen);
      return this.ACTION((): A.Expr => {
        const span = this.spanFrom(this.tokSpan(open));
        // The parentheses belong to the span, so messages quote `(x+1)` whole.
        return items.length === 1 ? { ...items[0], span } : { kind: "Tuple", items, span };
      });
    },
    this.recover,
  );

  /// `[…]`: a List, a matrix (rows separated by `;`) or a comprehension.
  bracketed = this.RULE(
    "bracketed",
    (): A.Expr => {
      const open = this.CONSUME(Tok.LBracket);
      const rows: A.Expr[][] = [[]];
      const clauses: A.ForClause[] = [];
      let matrix = false;
      this.OPTION(() => {
        const first = this.SUBRULE(this.expression);
        this.ACTION(() => rows[0].push(first));
        this.OR([
          {
            ALT: () =>
              this.AT_LEAST_ONE(() => {
                const f = this.CONSUME(Tok.For);
                const id = this.CONSUME(Tok.Identifier);
                this.CONSUME(Tok.In);
                const source = this.SUBRULE2(this.expression);
                this.ACTION(() => clauses.push({ kind: "ForClause", name: this.name(id), source, span: this.spanFrom(this.tokSpan(f)) }));
              }),
          },
          {
            ALT: () => {
              this.MANY(() => {
                this.CONSUME(Tok.Comma);
                const x = this.SUBRULE3(this.expression);
                this.ACTION(() => rows[rows.length - 1].push(x));
              });
              this.MANY2(() => {
                this.CONSUME(Tok.Semicolon);
                this.ACTION(() => {
                  matrix = true;
                  rows.push([]);
                });
                this.OPTION2(() => {
                  const x = this.SUBRULE4(this.expression);
                  this.ACTION(() => rows[rows.length - 1].push(x));
                  this.MANY3(() => {
                    this.CONSUME2(Tok.Comma);
                    const y = this.SUBRULE5(this.expression);
                    this.ACTION(() => rows[rows.length - 1].push(y));
                  });
                });
              });
            },
          },
        ]);
      });
      this.CONSUME(Tok.RBracket);
      return this.ACTION((): A.Expr => {
        const span = this.spanFrom(this.tokSpan(open));
        if (clauses.length > 0) return { kind: "Comprehension", element: rows[0][0], clauses, span };
        if (!matrix) return { kind: "ListLit", items: rows[0], span };
        if (rows.length > 1 && rows[rows.length - 1].length === 0) rows.pop();
        return { kind: "MatrixLit", rows, span };
      });
    },
    this.recover,
  );

  record = this.RULE(
    "record",
    (): A.Expr => {
      const open = this.CONSUME(Tok.LBrace);
      const fields: A.RecordField[] = [];
      this.MANY_SEP({
        SEP: Tok.Comma,
        DEF: () => {
          const id = this.CONSUME(Tok.Identifier);
          this.CONSUME(Tok.Colon);
          const value = this.SUBRULE(this.expression);
          this.ACTION(() => {
            const name = this.name(id);
            fields.push({ kind: "RecordField", name, value, span: { from: name.span.from, to: value.span.to } });
          });
        },
      });
      this.CONSUME(Tok.RBrace);
      return this.ACTION(() => ({ kind: "RecordLit", fields, span: this.spanFrom(this.tokSpan(open)) }) as A.RecordLit);
    },
    this.recover,
  );

  idealLiteral = this.RULE(
    "idealLiteral",
    (): A.Expr => {
      const open = this.CONSUME(Tok.IdealOpen);
      const gens: A.Expr[] = [];
      this.MANY_SEP({
        SEP: Tok.Comma,
        DEF: () => {
          const g = this.SUBRULE(this.expression);
          this.ACTION(() => gens.push(g));
        },
      });
      this.CONSUME(Tok.IdealClose);
      return this.ACTION(() => ({ kind: "IdealLit", gens, span: this.spanFrom(this.tokSpan(open)) }) as A.IdealLit);
    },
    this.recover,
  );
}

let shared: NotationParser | undefined;
const parser = (): NotationParser => (shared ??= new NotationParser());

export interface ParseResult {
  readonly program: A.Program;
  readonly errors: Diagnostic[];
  /// Indices of statements that had a parse error (the checker skips their types).
  readonly broken: ReadonlySet<number>;
}

/// Parses a whole program; never throws. Every statement is parsed on its own, so an
/// error in one does not hide errors in the next.
export function parse(source: string): ParseResult {
  const loc = makeLocator(source);
  const raw = lexRaw(source);
  const laid = layout(source, raw);
  const errors: { d: Diagnostic; stmt: number }[] = [];
  const span = (from: number, to: number): A.Span => ({ from: loc.at(from), to: loc.at(to) });

  for (const b of raw.bad) {
    const ch = source.slice(b.offset, b.offset + b.length);
    errors.push({
      d: { kind: "parse", message: `unexpected character \`${ch}\``, span: span(b.offset, b.offset + b.length) },
      stmt: -1,
    });
  }
  for (const e of laid.errors) errors.push({ d: { kind: "parse", message: e.message, span: span(e.from, e.to) }, stmt: -1 });

  const statements: A.Statement[] = [];
  const broken = new Set<number>();
  const p = parser();
  laid.statements.forEach((tokens, index) => {
    const first = tokens[0];
    const last = tokens[tokens.length - 1];
    const stmtEnd = last.startOffset + last.image.length;
    for (const t of tokens) {
      if (t.tokenType === Tok.UnterminatedStr) {
        errors.push({
          d: {
            kind: "parse",
            message: 'unterminated string: expected a closing `"` on the same line',
            span: span(t.startOffset, t.startOffset + t.image.length),
          },
          stmt: index,
        });
        broken.add(index);
      }
    }
    const clean = tokens.filter((t) => t.tokenType !== Tok.UnterminatedStr);
    if (nestingDepth(clean) > MAX_NESTING) {
      const s = span(first.startOffset, stmtEnd);
      errors.push({
        d: { kind: "parse", message: `brackets are nested more than ${MAX_NESTING} levels deep in this statement`, span: s },
        stmt: index,
      });
      broken.add(index);
      statements.push({ kind: "ExprStatement", expr: { kind: "ErrorExpr", span: s }, span: s });
      return;
    }
    if (clean.length === 0) {
      const s = span(first.startOffset, stmtEnd);
      statements.push({ kind: "ExprStatement", expr: { kind: "ErrorExpr", span: s }, span: s });
      return;
    }
    p.load(loc, clean);
    let stmt: A.Statement;
    let failed = false;
    try {
      stmt = p.statement();
    } catch {
      // Only a call stack exhausted by a pathological chain (e.g. thousands of `^`) gets here.
      failed = true;
      stmt = {
        kind: "ExprStatement",
        expr: { kind: "ErrorExpr", span: span(first.startOffset, stmtEnd) },
        span: span(first.startOffset, stmtEnd),
      };
      errors.push({
        d: { kind: "parse", message: "this statement is nested too deeply to read — split it into several definitions", span: stmt.span },
        stmt: index,
      });
      broken.add(index);
    }
    // After an unreadable character the parser's complaints are only its echo.
    const hasBadChar = failed || raw.bad.some((b) => b.offset >= first.startOffset && b.offset < stmtEnd);
    for (const err of p.errors) {
      if (!hasBadChar) errors.push({ d: recognitionError(err, clean, loc, stmtEnd), stmt: index });
      broken.add(index);
    }
    for (const x of p.extra) {
      errors.push({ d: { kind: "parse", message: x.message, span: x.span }, stmt: index });
      broken.add(index);
    }
    statements.push(
      stmt ?? {
        kind: "ExprStatement",
        expr: { kind: "ErrorExpr", span: span(first.startOffset, first.startOffset) },
        span: span(first.startOffset, first.startOffset),
      },
    );
  });
  for (const e of errors) if (e.stmt === -1) markBroken(e.d, statements, broken);

  const sorted = errors.map((e) => e.d).sort((a, b) => a.span.from.offset - b.span.from.offset);
  const program: A.Program = { kind: "Program", statements, span: span(0, source.length) };
  return { program, errors: dedupe(sorted), broken };
}

/// Deeper nesting is refused before parsing, so the parser's recursion stays bounded.
const MAX_NESTING = LIMIT_TABLE.bracketNesting.value;
const OPENING = new Set<TokenType>([Tok.LParen, Tok.LBracket, Tok.LBrace, Tok.IdealOpen]);
const CLOSING = new Set<TokenType>([Tok.RParen, Tok.RBracket, Tok.RBrace, Tok.IdealClose]);

function nestingDepth(tokens: IToken[]): number {
  let depth = 0;
  let max = 0;
  for (const t of tokens) {
    if (OPENING.has(t.tokenType)) max = Math.max(max, ++depth);
    else if (CLOSING.has(t.tokenType)) depth--;
  }
  return max;
}

/// A lexical error breaks the statement it falls in.
function markBroken(d: Diagnostic, statements: A.Statement[], broken: Set<number>): void {
  const at = d.span.from.offset;
  const i = statements.findIndex((s) => s.span.from.offset <= at && at <= s.span.to.offset);
  if (i >= 0) broken.add(i);
}

function dedupe(ds: Diagnostic[]): Diagnostic[] {
  const seen = new Set<string>();
  return ds.filter((d) => {
    const k = `${d.span.from.offset}:${d.span.to.offset}:${d.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

function recognitionError(err: IRecognitionException, tokens: IToken[], loc: Locator, stmtEnd: number): Diagnostic {
  const t = err.token;
  const real = t && t.tokenType !== EOF && Number.isFinite(t.startOffset);
  const from = real ? t.startOffset : stmtEnd;
  const to = real ? t.startOffset + t.image.length : stmtEnd;
  let message = err.message;
  if (err.name === "NotAllInputParsedException" && real) {
    const i = tokens.indexOf(t);
    const prev = i > 0 ? tokens[i - 1] : undefined;
    if (prev && ENDS_OPERAND.has(prev.tokenType) && OPERAND_START.has(t.tokenType)) {
      const glue = t.tokenType === Tok.LParen ? "(…)" : t.image;
      message += ` — there is no implicit multiplication; did you mean ${prev.image}*${glue}?`;
    }
  }
  return { kind: "parse", message, span: { from: loc.at(from), to: loc.at(Math.max(from, to)) } };
}

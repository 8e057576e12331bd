/// The notation's tokens (notation.md §1) and the Chevrotain lexer, shared by the
/// parser and the editor's highlighter.
import { createToken, Lexer, type IToken, type TokenType } from "chevrotain";

const Identifier = createToken({ name: "Identifier", pattern: /[A-Za-z][A-Za-z0-9_']*/, label: "a name" });

const keyword = (word: string): TokenType =>
  createToken({ name: word[0].toUpperCase() + word.slice(1), pattern: new RegExp(word), longer_alt: Identifier, label: `\`${word}\`` });

const punct = (name: string, pattern: RegExp | string, text: string): TokenType => createToken({ name, pattern, label: `\`${text}\`` });

export const Tok = {
  WhiteSpace: createToken({ name: "WhiteSpace", pattern: /[ \t\r\f\v\u00a0]+/, group: Lexer.SKIPPED }),
  Comment: createToken({ name: "Comment", pattern: /#[^\n]*/, group: "comments" }),
  Newline: createToken({ name: "Newline", pattern: /\n/, label: "a new line" }),
  Str: createToken({ name: "Str", pattern: /"(?:[^"\\\n]|\\.)*"/, label: "a string" }),
  UnterminatedStr: createToken({ name: "UnterminatedStr", pattern: /"(?:[^"\\\n]|\\.)*/, label: "an unterminated string" }),
  /// `2x`: digits run into a name; reported as a missing `*`.
  NumberName: createToken({ name: "NumberName", pattern: /[0-9]+[A-Za-z][A-Za-z0-9_']*/, label: "a number followed by a name" }),
  Integer: createToken({ name: "Integer", pattern: /[0-9]+/, label: "a number" }),
  Use: keyword("use"),
  In: keyword("in"),
  For: keyword("for"),
  If: keyword("if"),
  Then: keyword("then"),
  Else: keyword("else"),
  And: keyword("and"),
  Or: keyword("or"),
  Not: keyword("not"),
  True: keyword("true"),
  False: keyword("false"),
  Identifier,
  Define: punct("Define", ":=", ":="),
  Arrow: punct("Arrow", /->|→/, "->"),
  DotDot: punct("DotDot", "..", ".."),
  Dot: punct("Dot", ".", "."),
  EqEq: punct("EqEq", "==", "=="),
  NotEq: punct("NotEq", "!=", "!="),
  LessEq: punct("LessEq", /<=|⊆/, "<="),
  GreaterEq: punct("GreaterEq", ">=", ">="),
  /// `<` and `>` as the lexer sees them; `layout` turns them into ideal brackets or
  /// comparisons by position.
  Lt: punct("Lt", "<", "<"),
  Gt: punct("Gt", ">", ">"),
  IdealOpen: punct("IdealOpen", "⟨", "<"),
  IdealClose: punct("IdealClose", "⟩", ">"),
  Equals: punct("Equals", "=", "="),
  Plus: punct("Plus", "+", "+"),
  Minus: punct("Minus", "-", "-"),
  Star: punct("Star", "*", "*"),
  Slash: punct("Slash", "/", "/"),
  Caret: punct("Caret", "^", "^"),
  Amp: punct("Amp", /&|∩/, "&"),
  Colon: punct("Colon", ":", ":"),
  MemberOf: punct("MemberOf", "∈", "in"),
  Semicolon: punct("Semicolon", ";", ";"),
  Comma: punct("Comma", ",", ","),
  LParen: punct("LParen", "(", "("),
  RParen: punct("RParen", ")", ")"),
  LBracket: punct("LBracket", "[", "["),
  RBracket: punct("RBracket", "]", "]"),
  LBrace: punct("LBrace", "{", "{"),
  RBrace: punct("RBrace", "}", "}"),
  /// Produced by `layout` from a newline or `;` outside brackets.
  End: createToken({ name: "End", pattern: Lexer.NA, label: "the end of the statement" }),
} as const;

/// Lexer order matters: longer operators before their prefixes, NumberName before Integer.
const LEXER_ORDER: TokenType[] = [
  Tok.WhiteSpace,
  Tok.Comment,
  Tok.Newline,
  Tok.Str,
  Tok.UnterminatedStr,
  Tok.NumberName,
  Tok.Integer,
  Tok.Use,
  Tok.In,
  Tok.For,
  Tok.If,
  Tok.Then,
  Tok.Else,
  Tok.And,
  Tok.Or,
  Tok.Not,
  Tok.True,
  Tok.False,
  Tok.Identifier,
  Tok.Define,
  Tok.Arrow,
  Tok.DotDot,
  Tok.Dot,
  Tok.EqEq,
  Tok.NotEq,
  Tok.LessEq,
  Tok.GreaterEq,
  Tok.Lt,
  Tok.Gt,
  Tok.IdealOpen,
  Tok.IdealClose,
  Tok.Equals,
  Tok.Plus,
  Tok.Minus,
  Tok.Star,
  Tok.Slash,
  Tok.Caret,
  Tok.Amp,
  Tok.Colon,
  Tok.MemberOf,
  Tok.Semicolon,
  Tok.Comma,
  Tok.LParen,
  Tok.RParen,
  Tok.LBracket,
  Tok.RBracket,
  Tok.LBrace,
  Tok.RBrace,
];

/// Every token type the parser may see.
export const ALL_TOKENS: TokenType[] = [...LEXER_ORDER, Tok.End];

/// The notation's keywords, for the editor (completion, highlighting).
export const KEYWORD_NAMES: readonly string[] = ["use", "in", "for", "if", "then", "else", "and", "or", "not", "true", "false"];

const KEYWORDS = new Set<TokenType>([Tok.Use, Tok.In, Tok.For, Tok.If, Tok.Then, Tok.Else, Tok.And, Tok.Or, Tok.Not]);

const lexer = new Lexer(LEXER_ORDER, {
  positionTracking: "full",
  ensureOptimizations: false,
  lineTerminatorsPattern: /\n/g,
  lineTerminatorCharacters: ["\n"],
});

export interface RawLex {
  readonly tokens: IToken[];
  readonly comments: IToken[];
  /// Characters that start no token: offset and length.
  readonly bad: { offset: number; length: number }[];
}

export function lexRaw(source: string): RawLex {
  const r = lexer.tokenize(source);
  return {
    tokens: r.tokens,
    comments: (r.groups.comments as IToken[] | undefined) ?? [],
    bad: r.errors.map((e) => ({ offset: e.offset, length: Math.max(1, e.length) })),
  };
}

/// Highlighting categories for the editor.
export type TokenCategory =
  "keyword" | "constant" | "function" | "identifier" | "number" | "string" | "comment" | "operator" | "bracket" | "punctuation" | "invalid";

export interface HighlightToken {
  readonly from: number;
  readonly to: number;
  readonly text: string;
  readonly category: TokenCategory;
}

const BRACKETS = new Set<TokenType>([
  Tok.LParen,
  Tok.RParen,
  Tok.LBracket,
  Tok.RBracket,
  Tok.LBrace,
  Tok.RBrace,
  Tok.IdealOpen,
  Tok.IdealClose,
]);
const PUNCTUATION = new Set<TokenType>([Tok.Comma, Tok.Semicolon, Tok.Newline, Tok.Dot]);

/// The category of one raw token; `isFunction` tells built-in function names apart.
function categoryOf(t: IToken, isFunction: (name: string) => boolean, next: IToken | undefined): TokenCategory {
  const type = t.tokenType;
  if (KEYWORDS.has(type)) return "keyword";
  if (type === Tok.True || type === Tok.False) return "constant";
  if (type === Tok.Integer) return "number";
  if (type === Tok.Str) return "string";
  if (type === Tok.UnterminatedStr || type === Tok.NumberName) return "invalid";
  if (type === Tok.Comment) return "comment";
  if (type === Tok.Identifier) {
    if (t.image === "Q" || t.image === "none") return "constant";
    return next?.tokenType === Tok.LParen && isFunction(t.image) ? "function" : "identifier";
  }
  if (BRACKETS.has(type)) return "bracket";
  if (PUNCTUATION.has(type)) return "punctuation";
  return "operator";
}

/// The tokens of a source text for highlighting, comments included, in order, with
/// unreadable characters as "invalid". `<`/`>` around ideals come out as "bracket".
export function tokenizeWith(source: string, isFunction: (name: string) => boolean): HighlightToken[] {
  const raw = lexRaw(source);
  const laidOut = new Set(layout(source, raw).idealBrackets);
  const out: HighlightToken[] = [];
  const all = [...raw.tokens, ...raw.comments].sort((a, b) => a.startOffset - b.startOffset);
  all.forEach((t, i) => {
    if (t.tokenType === Tok.Newline) return;
    const category = laidOut.has(t.startOffset) ? "bracket" : categoryOf(t, isFunction, all[i + 1]);
    out.push({ from: t.startOffset, to: t.startOffset + t.image.length, text: t.image, category });
  });
  for (const b of raw.bad) {
    out.push({ from: b.offset, to: b.offset + b.length, text: source.slice(b.offset, b.offset + b.length), category: "invalid" });
  }
  return out.sort((a, b) => a.from - b.from);
}

/// A lexical problem found by `layout`, by offsets.
export interface LayoutError {
  readonly message: string;
  readonly from: number;
  readonly to: number;
}

export interface Layout {
  /// The tokens of each statement, in order, without statement ends.
  readonly statements: IToken[][];
  readonly errors: LayoutError[];
  /// Offsets of `<` and `>` tokens read as ideal brackets.
  readonly idealBrackets: number[];
}

const OPENERS = new Map<TokenType, TokenType>([
  [Tok.LParen, Tok.RParen],
  [Tok.LBracket, Tok.RBracket],
  [Tok.LBrace, Tok.RBrace],
  [Tok.IdealOpen, Tok.IdealClose],
]);
const CLOSER_OF = new Map<TokenType, TokenType>([...OPENERS].map(([o, c]) => [c, o]));

/// Tokens after which a `<` is a comparison (they end an operand); elsewhere `<`
/// starts a primary expression and so opens an ideal. The parser uses the same set to
/// tell two operands written side by side.
export const ENDS_OPERAND = new Set<TokenType>([
  Tok.Identifier,
  Tok.Integer,
  Tok.Str,
  Tok.True,
  Tok.False,
  Tok.RParen,
  Tok.RBracket,
  Tok.RBrace,
  Tok.IdealClose,
]);

const STARTS_OPERAND = new Set<TokenType>([
  Tok.Identifier,
  Tok.Integer,
  Tok.NumberName,
  Tok.Str,
  Tok.True,
  Tok.False,
  Tok.If,
  Tok.Not,
  Tok.Use,
]);

function retype(t: IToken, type: TokenType, image?: string, startOffset?: number): IToken {
  const start = startOffset ?? t.startOffset;
  const img = image ?? t.image;
  return {
    ...t,
    image: img,
    startOffset: start,
    endOffset: start + img.length - 1,
    startColumn: undefined,
    endColumn: undefined,
    tokenType: type,
    tokenTypeIdx: type.tokenTypeIdx!,
  };
}

/// Splits the raw tokens into statements (newline or `;` outside brackets; a line
/// continues inside open brackets), decides `<`/`>` between ideal brackets and
/// comparisons, closes brackets left open at a statement's end (reporting them),
/// drops unmatched closers (reporting them) and turns `2x` into `2*x` (reporting it).
export function layout(source: string, raw: RawLex): Layout {
  const statements: IToken[][] = [];
  const errors: LayoutError[] = [];
  const idealBrackets: number[] = [];
  let current: IToken[] = [];
  const stack: IToken[] = [];
  const tokens = raw.tokens;

  const closeStatement = () => {
    while (stack.length > 0) {
      const open = stack.pop()!;
      const closer = OPENERS.get(open.tokenType)!;
      const closerText = closer === Tok.IdealClose ? ">" : closer.LABEL!.slice(1, -1);
      const openText = open.tokenType === Tok.IdealOpen ? "<" : open.image;
      errors.push({
        message: `unclosed \`${openText}\`: expected \`${closerText}\` before the end of the statement`,
        from: open.startOffset,
        to: open.startOffset + open.image.length,
      });
      const last = current[current.length - 1];
      const at = last ? last.startOffset + last.image.length : open.startOffset + open.image.length;
      current.push(retype(open, closer, "", at));
    }
    if (current.length > 0) statements.push(current);
    current = [];
  };

  for (let i = 0; i < tokens.length; i++) {
    let t = tokens[i];
    const type = t.tokenType;
    const top = stack[stack.length - 1];
    if (type === Tok.Newline) {
      if (stack.length === 0 || startsNewStatement(tokens, i + 1, current[current.length - 1])) closeStatement();
      continue;
    }
    if (type === Tok.Semicolon && stack.length === 0) {
      closeStatement();
      continue;
    }
    if (type === Tok.NumberName) {
      const digits = /^[0-9]+/.exec(t.image)![0];
      const name = t.image.slice(digits.length);
      errors.push({
        message: `a number runs into a name: \`${t.image}\` — there is no implicit multiplication; did you mean ${digits}*${name}?`,
        from: t.startOffset,
        to: t.startOffset + t.image.length,
      });
      current.push(retype(t, Tok.Integer, digits));
      current.push(retype(t, Tok.Star, "", t.startOffset + digits.length));
      current.push(retype(t, Tok.Identifier, name, t.startOffset + digits.length));
      continue;
    }
    if (type === Tok.Lt) {
      const prev = current[current.length - 1];
      if (!prev || !ENDS_OPERAND.has(prev.tokenType)) {
        t = retype(t, Tok.IdealOpen);
        idealBrackets.push(t.startOffset);
      }
    } else if (type === Tok.Gt && top?.tokenType === Tok.IdealOpen) {
      t = retype(t, Tok.IdealClose);
      idealBrackets.push(t.startOffset);
    }
    const ttype = t.tokenType;
    if (OPENERS.has(ttype)) {
      stack.push(t);
    } else if (CLOSER_OF.has(ttype)) {
      const opener = CLOSER_OF.get(ttype)!;
      if (!stack.some((s) => s.tokenType === opener)) {
        errors.push({
          message: `unmatched \`${t.image === "⟩" ? ">" : t.image}\`: no open \`${opener === Tok.IdealOpen ? "<" : opener.LABEL!.slice(1, -1)}\` before it`,
          from: t.startOffset,
          to: t.startOffset + t.image.length,
        });
        continue;
      }
      while (stack.length > 0 && stack[stack.length - 1].tokenType !== opener) {
        const open = stack.pop()!;
        const closer = OPENERS.get(open.tokenType)!;
        errors.push({
          message: `unclosed \`${open.tokenType === Tok.IdealOpen ? "<" : open.image}\`: expected \`${closer === Tok.IdealClose ? ">" : closer.LABEL!.slice(1, -1)}\` before \`${t.image}\``,
          from: open.startOffset,
          to: open.startOffset + open.image.length,
        });
        current.push(retype(open, closer, "", t.startOffset));
      }
      stack.pop();
    }
    current.push(t);
  }
  closeStatement();
  return { statements, errors, idealBrackets };
}

/// Inside open brackets a new line normally continues the statement; but a line that
/// begins a definition (`name :=`) or `use`, or an operand right after an operand
/// (nothing could join them), surely starts a new one. This keeps a forgotten closer
/// from swallowing the rest of the program.
function startsNewStatement(tokens: IToken[], i: number, prev: IToken | undefined): boolean {
  const a = tokens[i];
  if (!a) return false;
  if (prev && ENDS_OPERAND.has(prev.tokenType) && STARTS_OPERAND.has(a.tokenType)) return true;
  if (a.tokenType === Tok.Use) return tokens[i + 1]?.tokenType === Tok.Identifier;
  return a.tokenType === Tok.Identifier && tokens[i + 1]?.tokenType === Tok.Define;
}

export type { IToken };

/// TeX for the notation's canonical texts (notation.md §9): polynomials such as
/// `x^2*y-2*x+3` or `3/4*x^2-y`, and the rational functions of series such as
/// `(1+t)/(1-t)^3`. Plain functions with no React, so they are unit-tested alone.

type Node =
  | { kind: "num"; text: string }
  | { kind: "var"; name: string }
  | { kind: "neg"; arg: Node }
  | { kind: "bin"; op: "+" | "-" | "*" | "/"; left: Node; right: Node }
  | { kind: "pow"; base: Node; exp: Node }
  | { kind: "group"; inner: Node };

const TOKEN = /\s*(?:(\d+)|([A-Za-z][A-Za-z0-9_']*)|([-+*/^()]))/y;

function lex(text: string): string[] | null {
  const out: string[] = [];
  TOKEN.lastIndex = 0;
  let at = 0;
  while (at < text.length) {
    if (/^\s*$/.test(text.slice(at))) break;
    TOKEN.lastIndex = at;
    const m = TOKEN.exec(text);
    if (!m) return null;
    out.push(m[1] ?? m[2] ?? m[3]);
    at = TOKEN.lastIndex;
  }
  return out;
}

/// A small precedence parser: sum of products of powers, as the canonical texts use.
function parse(tokens: string[]): Node | null {
  let i = 0;
  const peek = () => tokens[i];
  const sum = (): Node | null => {
    let left: Node | null;
    if (peek() === "-") {
      i++;
      const arg = product();
      left = arg && { kind: "neg", arg };
    } else left = product();
    while (left && (peek() === "+" || peek() === "-")) {
      const op = tokens[i++] as "+" | "-";
      const right = product();
      if (!right) return null;
      left = { kind: "bin", op, left, right };
    }
    return left;
  };
  const product = (): Node | null => {
    let left = power();
    while (left && (peek() === "*" || peek() === "/")) {
      const op = tokens[i++] as "*" | "/";
      const right = power();
      if (!right) return null;
      left = { kind: "bin", op, left, right };
    }
    return left;
  };
  const power = (): Node | null => {
    const base = atom();
    if (!base || peek() !== "^") return base;
    i++;
    const negative = peek() === "-";
    if (negative) i++;
    const exp = atom();
    if (!exp) return null;
    return { kind: "pow", base, exp: negative ? { kind: "neg", arg: exp } : exp };
  };
  const atom = (): Node | null => {
    const t = tokens[i];
    if (t === undefined) return null;
    if (t === "(") {
      i++;
      const inner = sum();
      if (!inner || tokens[i] !== ")") return null;
      i++;
      return { kind: "group", inner };
    }
    if (/^\d/.test(t)) {
      i++;
      return { kind: "num", text: t };
    }
    if (/^[A-Za-z]/.test(t)) {
      i++;
      return { kind: "var", name: t };
    }
    return null;
  };
  const tree = sum();
  return tree && i === tokens.length ? tree : null;
}

/// A variable name as TeX: trailing digits or a `_suffix` become a subscript, primes
/// stay, longer names are set in italic as one word.
export function texOfVariable(name: string): string {
  const primes = /'+$/.exec(name)?.[0] ?? "";
  const core = name.slice(0, name.length - primes.length);
  const word = (w: string) => (w.length === 1 ? w : `\\mathit{${w}}`);
  const sub = /^([A-Za-z]+?)_?(\d+)$/.exec(core) ?? /^([A-Za-z]+)_([A-Za-z0-9_]+)$/.exec(core);
  if (sub) return `${word(sub[1])}_{${sub[2].replace(/_/g, "\\_")}}${primes}`;
  return `${word(core.replace(/_/g, "\\_"))}${primes}`;
}

/// Whether a product `a*b` may be written by juxtaposition (no visible sign): only
/// when the right factor does not start with a digit, which would merge with `a`.
function startsWithDigit(n: Node): boolean {
  if (n.kind === "num") return true;
  if (n.kind === "pow") return startsWithDigit(n.base);
  if (n.kind === "bin") return startsWithDigit(n.left);
  return false;
}

function render(n: Node): string {
  switch (n.kind) {
    case "num":
      return n.text;
    case "var":
      return texOfVariable(n.name);
    case "neg":
      return `-${render(n.arg)}`;
    case "group":
      return `\\left(${render(n.inner)}\\right)`;
    case "pow": {
      const exp = n.exp.kind === "group" ? render(n.exp.inner) : render(n.exp);
      return `${render(n.base)}^{${exp}}`;
    }
    case "bin": {
      if (n.op === "/") {
        const strip = (x: Node) => (x.kind === "group" ? x.inner : x);
        return `\\frac{${render(strip(n.left))}}{${render(strip(n.right))}}`;
      }
      if (n.op === "*") {
        const rational = rationalCoefficient(n);
        if (rational) return rational;
        const right = render(n.right);
        return startsWithDigit(n.right) ? `${render(n.left)} \\cdot ${right}` : `${render(n.left)}${right}`;
      }
      return `${render(n.left)} ${n.op} ${render(n.right)}`;
    }
  }
}

/// `3/4*x^2` parses as ((3/4)*x^2): set the coefficient as a fraction before the monomial.
function rationalCoefficient(n: Node & { kind: "bin" }): string | null {
  const l = n.left;
  if (l.kind === "bin" && l.op === "/" && l.left.kind === "num" && l.right.kind === "num") {
    return `\\frac{${l.left.text}}{${l.right.text}}${render(n.right)}`;
  }
  return null;
}

/// TeX of a polynomial or rational-function text; null when the text is not in the
/// notation's arithmetic form (the caller then shows it verbatim).
export function texOfExpression(text: string): string | null {
  const tokens = lex(text.trim());
  if (!tokens || tokens.length === 0) return null;
  const tree = parse(tokens);
  return tree ? render(tree) : null;
}

const TEXT_ESCAPES: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "{": "\\{",
  "}": "\\}",
  "^": "\\textasciicircum{}",
  "~": "\\textasciitilde{}",
  _: "\\_",
  $: "\\$",
  "&": "\\&",
  "#": "\\#",
  "%": "\\%",
};

/// TeX of an expression text, falling back to typewriter text when it does not parse.
export function texOrVerbatim(text: string): string {
  return texOfExpression(text) ?? `\\texttt{${text.replace(/[\\{}^~_$&#%]/g, (c) => TEXT_ESCAPES[c])}}`;
}

/// TeX of an ideal from its generators' texts: ⟨f₁, …, fₙ⟩.
export function texOfIdeal(gens: readonly string[]): string {
  return `\\left\\langle ${gens.length === 0 ? "0" : gens.map(texOrVerbatim).join(",\\ ")} \\right\\rangle`;
}

/// TeX of a matrix from rows of polynomial texts.
export function texOfMatrix(rows: readonly (readonly string[])[]): string {
  if (rows.length === 0 || rows[0].length === 0) return "\\left(\\,\\right)";
  const body = rows.map((r) => r.map(texOrVerbatim).join(" & ")).join(" \\\\ ");
  return `\\begin{pmatrix} ${body} \\end{pmatrix}`;
}

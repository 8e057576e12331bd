/// Hover documentation for the input: the signature table (grammar/signatures.ts) — the
/// same table the checker, completion, highlighting and the /reference page read — says
/// what the word under the pointer is: a function with its overloads, options,
/// description and example; a property or method of the value before the dot; a
/// constant; a ring option inside ring brackets.
import type { Extension } from "@codemirror/state";
import { hoverTooltip } from "@codemirror/view";
import {
  CONSTANTS,
  PROPERTIES,
  RING_OPTIONS,
  formatOverload,
  formatProperty,
  lookupFunction,
  lookupProperty,
  type PropertySig,
} from "@/grammar/signatures";
import { typeToString } from "@/grammar/types";
import { completionPlace } from "./completion-context";
import { ownerKinds, typeBefore, type NotationCompletionOptions } from "./notation-completion";

/// What the hover shows for one word: its span in the source, a heading line per
/// signature, and the description (and example) in words.
export interface HoverDoc {
  readonly from: number;
  readonly to: number;
  readonly signatures: readonly string[];
  readonly description: string;
  readonly example?: string;
}

const WORD = /[A-Za-z0-9_']/;

/// The identifier around `pos` (touching it from either side), or null.
function wordAt(source: string, pos: number): { from: number; to: number; word: string } | null {
  let from = pos;
  let to = pos;
  while (from > 0 && WORD.test(source[from - 1])) from--;
  while (to < source.length && WORD.test(source[to])) to++;
  if (from === to || !/[A-Za-z_]/.test(source[from])) return null;
  return { from, to, word: source.slice(from, to) };
}

function propertyDoc(props: readonly PropertySig[], from: number, to: number): HoverDoc | null {
  if (props.length === 0) return null;
  const descriptions = [...new Set(props.map((q) => q.description))];
  return { from, to, signatures: props.map(formatProperty), description: descriptions.join("; ") };
}

/// The documentation of the word at `pos` in `source`, or null when the table has none
/// (a binding, a variable, a keyword, a number).
export function hoverDoc(options: NotationCompletionOptions, source: string, pos: number): HoverDoc | null {
  const w = wordAt(source, pos);
  if (!w) return null;
  const { from, to, word } = w;
  // After a dot: a property of the value before it; when its type is unknown, every
  // property of that name, each with its owner.
  let dot = from - 1;
  while (dot >= 0 && /[ \t]/.test(source[dot])) dot--;
  if (dot >= 0 && source[dot] === "." && source[dot - 1] !== ".") {
    const t = typeBefore(options, source, dot);
    const owned = t
      ? ownerKinds(t)
          .map((k) => lookupProperty(k, word))
          .filter((q): q is PropertySig => q !== undefined)
      : [];
    return propertyDoc(owned.length ? owned : PROPERTIES.filter((q) => q.name === word), from, to);
  }
  if (completionPlace(source, to).kind === "ring-option") {
    const o = RING_OPTIONS.find((r) => r.name === word);
    if (o) return { from, to, signatures: [`${o.name} = ${o.values}`], description: `${o.description} (default ${o.default})` };
  }
  const f = lookupFunction(word);
  if (f) return { from, to, signatures: f.overloads.map((o) => formatOverload(f, o)), description: f.description, example: f.example };
  const c = CONSTANTS.find((k) => k.name === word);
  if (c) return { from, to, signatures: [`${c.name}: ${typeToString(c.type)}`], description: c.description };
  return null;
}

function render(doc: HoverDoc): HTMLElement {
  const dom = document.createElement("div");
  dom.className = "rs-hover";
  dom.setAttribute("data-testid", "notation-hover");
  for (const s of doc.signatures) {
    const line = document.createElement("code");
    line.className = "rs-hover-signature";
    line.textContent = s;
    dom.append(line);
  }
  const words = document.createElement("p");
  words.textContent = doc.description;
  dom.append(words);
  if (doc.example) {
    const ex = document.createElement("p");
    ex.textContent = `e.g. ${doc.example}`;
    dom.append(ex);
  }
  return dom;
}

/// The hover extension for the Ringside input.
export function notationHover(options: NotationCompletionOptions): Extension {
  return hoverTooltip((view, pos) => {
    const doc = hoverDoc(options, view.state.doc.toString(), pos);
    return doc ? { pos: doc.from, end: doc.to, above: true, create: () => ({ dom: render(doc) }) } : null;
  });
}

/// The highlighter's tokens come from the parser's own lexer.
import { expect, test } from "vitest";
import { tokenize } from "@/grammar/index";

test("categories of a typical line", () => {
  const src = 'I := <x^2, y> # note\nif 2 < 3 then resolve(S / I) else "no"';
  const shown = tokenize(src).map((t) => `${t.text}:${t.category}`);
  expect(shown).toEqual([
    "I:identifier",
    ":=:operator",
    "<:bracket",
    "x:identifier",
    "^:operator",
    "2:number",
    ",:punctuation",
    "y:identifier",
    ">:bracket",
    "# note:comment",
    "if:keyword",
    "2:number",
    "<:operator",
    "3:number",
    "then:keyword",
    "resolve:function",
    "(:bracket",
    "S:identifier",
    "/:operator",
    "I:identifier",
    "):bracket",
    "else:keyword",
    '"no":string',
  ]);
});

test("constants, aliases and invalid input", () => {
  const shown = tokenize("Q ∩ none ⊆ true 2x @").map((t) => `${t.text}:${t.category}`);
  expect(shown).toEqual(["Q:constant", "∩:operator", "none:constant", "⊆:operator", "true:constant", "2x:invalid", "@:invalid"]);
});

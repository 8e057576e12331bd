/// A resolution as a chain of free modules 0 ← R^{r_0} ← R^{r_1} ← … (ranks from §9's
/// Complex "ranks"), written as TeX; a truncated resolution ends in an ellipsis.

/// TeX of the chain of ranks; `ring` is the TeX of the base ring's name.
export function texOfRankChain(ranks: readonly number[], complete: boolean, ring = "R"): string {
  const parts = ranks.map((r) => (r === 1 ? ring : `${ring}^{${r}}`));
  const tail = complete ? " \\leftarrow 0" : " \\leftarrow \\cdots";
  return `0 \\leftarrow ${parts.join(" \\leftarrow ")}${ranks.length ? tail : ""}`;
}

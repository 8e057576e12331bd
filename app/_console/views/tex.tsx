"use client";
/// Typesets a TeX string with KaTeX; a string KaTeX rejects is shown as code instead.
import katex from "katex";
import "katex/dist/katex.min.css";
import { useMemo } from "react";

/// Inline or display maths from TeX; `label` is the plain text read out by assistive
/// technology and shown when KaTeX cannot set the formula.
export function Tex({ tex, label, display = false }: { tex: string; label: string; display?: boolean }) {
  const html = useMemo(() => {
    try {
      return katex.renderToString(tex, { throwOnError: true, displayMode: display, output: "htmlAndMathml" });
    } catch {
      return null;
    }
  }, [tex, display]);
  if (html === null) return <code className="font-mono">{label}</code>;
  return <span className="rs-tex" title={label} dangerouslySetInnerHTML={{ __html: html }} />;
}

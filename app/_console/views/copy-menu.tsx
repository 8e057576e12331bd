"use client";
/// The copy menu of one result: plain text, LaTeX, Markdown, and CSV for tables (the
/// formats of render/copy-formats.ts); says what it copied.
import { useEffect, useRef, useState } from "react";
import type { ValueReading } from "@/lib/wire/reading";
import { COPY_LABELS, copyFormats, copyText, type CopyFormat } from "../render/copy-formats";
import type { ViewContext } from "../render/view-model";
import { buttonQuiet } from "./styles";

/// Writes text to the clipboard; the older selection-based copy where the API is missing
/// (a page not served over https or localhost).
async function writeClipboard(text: string): Promise<void> {
  if (navigator.clipboard?.writeText) return navigator.clipboard.writeText(text);
  const area = document.createElement("textarea");
  area.value = text;
  area.style.position = "fixed";
  area.style.opacity = "0";
  document.body.appendChild(area);
  area.select();
  const ok = document.execCommand("copy");
  area.remove();
  if (!ok) throw new Error("the browser did not allow copying");
}

export function CopyMenu({ value, context }: { value: ValueReading; context?: ViewContext }) {
  const [open, setOpen] = useState(false);
  const [status, setStatus] = useState<string | null>(null);
  const root = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    const close = (e: MouseEvent) => {
      if (!root.current?.contains(e.target as Node)) setOpen(false);
    };
    document.addEventListener("mousedown", close);
    return () => document.removeEventListener("mousedown", close);
  }, [open]);

  const copy = async (format: CopyFormat) => {
    setOpen(false);
    try {
      await writeClipboard(copyText(value, format, context));
      setStatus(`Copied as ${COPY_LABELS[format]}`);
    } catch (e) {
      setStatus(`Not copied: ${e instanceof Error ? e.message : String(e)}`);
    }
    window.setTimeout(() => setStatus(null), 2500);
  };

  return (
    <div ref={root} className="relative shrink-0" onKeyDown={(e) => e.key === "Escape" && setOpen(false)}>
      <button
        type="button"
        className={buttonQuiet}
        aria-haspopup="menu"
        aria-expanded={open}
        aria-label="Copy this result"
        onClick={() => setOpen((o) => !o)}
      >
        Copy
      </button>
      {open && (
        <ul
          role="menu"
          className="absolute right-0 z-20 mt-1 w-36 rounded-md border border-ink/20 bg-white py-1 text-sm shadow-lg dark:border-paper/20 dark:bg-night-panel"
        >
          {copyFormats(value).map((f) => (
            <li key={f} role="none">
              <button
                type="button"
                role="menuitem"
                className="w-full px-3 py-1 text-left hover:bg-ink/5 focus:bg-ink/10 focus:outline-none dark:hover:bg-paper/10"
                onClick={() => void copy(f)}
              >
                {COPY_LABELS[f]}
              </button>
            </li>
          ))}
        </ul>
      )}
      {status && (
        <span
          role="status"
          className="absolute right-0 top-full mt-1 whitespace-nowrap rounded bg-ink px-2 py-0.5 text-xs text-paper dark:bg-paper dark:text-night"
        >
          {status}
        </span>
      )}
    </div>
  );
}

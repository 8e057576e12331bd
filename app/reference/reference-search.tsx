"use client";
/// The reference's search box: hides every entry (function, property, ring option) whose
/// text does not contain all the typed words, and says how many are left. `?q=` fills it.
import { useEffect, useState } from "react";

export function ReferenceSearch() {
  const [query, setQuery] = useState("");
  const [shown, setShown] = useState<number | null>(null);

  useEffect(() => {
    const q = new URLSearchParams(window.location.search).get("q");
    if (q) setQuery(q);
  }, []);

  useEffect(() => {
    const words = query
      .toLowerCase()
      .split(/\s+/)
      .filter((w) => w !== "");
    let count = 0;
    document.querySelectorAll<HTMLElement>("[data-ref-entry]").forEach((el) => {
      const text = (el.textContent ?? "").toLowerCase();
      const hit = words.every((w) => text.includes(w));
      // (the style, not `hidden`: some entries are `display: contents` rows of a grid)
      el.style.display = hit ? "" : "none";
      el.dataset.refHidden = hit ? "" : "true";
      if (hit) count++;
    });
    // a group whose entries are all hidden is hidden with them
    document.querySelectorAll<HTMLElement>("[data-ref-group]").forEach((g) => {
      g.style.display = g.querySelector('[data-ref-entry]:not([data-ref-hidden="true"])') === null ? "none" : "";
    });
    setShown(words.length === 0 ? null : count);
  }, [query]);

  return (
    <div className="sticky top-0 z-10 -mx-2 bg-paper/95 px-2 py-2 dark:bg-night/95">
      <input
        type="search"
        autoFocus
        aria-label="Search the notation reference"
        placeholder="Search functions, properties and options…"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        className="w-full rounded-md border border-ink/20 bg-white px-3 py-2 text-sm dark:border-paper/20 dark:bg-night-panel"
      />
      {shown !== null && (
        <p className="mt-1 text-xs text-ink-soft" role="status">
          {shown === 0 ? "Nothing in the reference matches." : `${shown} entr${shown === 1 ? "y" : "ies"} match.`}
        </p>
      )}
    </div>
  );
}

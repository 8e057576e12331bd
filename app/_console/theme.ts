"use client";
/// Light and dark themes: the `dark` class on <html> (Tailwind `darkMode: "class"`),
/// remembered in localStorage, starting from the system preference.
import { useCallback, useEffect, useState } from "react";

export type Theme = "light" | "dark";
const KEY = "ringside.theme";

/// The current theme and a switch.
export function useTheme(): { theme: Theme; toggle: () => void } {
  const [theme, setTheme] = useState<Theme>("light");
  useEffect(() => {
    const stored = window.localStorage.getItem(KEY);
    const initial: Theme =
      stored === "dark" || stored === "light" ? stored : window.matchMedia?.("(prefers-color-scheme: dark)").matches ? "dark" : "light";
    setTheme(initial);
  }, []);
  useEffect(() => {
    document.documentElement.classList.toggle("dark", theme === "dark");
  }, [theme]);
  const toggle = useCallback(() => {
    setTheme((t) => {
      const next = t === "dark" ? "light" : "dark";
      window.localStorage.setItem(KEY, next);
      return next;
    });
  }, []);
  return { theme, toggle };
}

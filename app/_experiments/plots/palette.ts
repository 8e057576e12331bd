"use client";
/// Colours of the plots in the console's palette (tailwind.config.ts) for the light and
/// dark themes. Plots carry their colours as attributes, not CSS classes, so a downloaded
/// SVG or PNG looks as it did on screen.
import { useEffect, useState } from "react";

export interface PlotPalette {
  background: string;
  text: string;
  muted: string;
  grid: string;
  mark: string;
  accent: string;
  /// the ends of sequential colour scales (low, high)
  low: string;
  high: string;
}

export const LIGHT: PlotPalette = {
  background: "#ffffff",
  text: "#0f3d3e",
  muted: "#2f6f6f",
  grid: "#ebe8df",
  mark: "#2f6f6f",
  accent: "#c77d14",
  low: "#ebe8df",
  high: "#0f3d3e",
};

export const DARK: PlotPalette = {
  background: "#1b2326",
  text: "#f6f5f1",
  muted: "#b9c3c4",
  grid: "#2b363a",
  mark: "#f1d19b",
  accent: "#c77d14",
  low: "#2b363a",
  high: "#f1d19b",
};

/// The palette of the theme in force: follows the `dark` class on <html> as it changes.
export function usePlotPalette(): PlotPalette {
  const [dark, setDark] = useState(false);
  useEffect(() => {
    const html = document.documentElement;
    const read = () => setDark(html.classList.contains("dark"));
    read();
    const watch = new MutationObserver(read);
    watch.observe(html, { attributes: true, attributeFilter: ["class"] });
    return () => watch.disconnect();
  }, []);
  return dark ? DARK : LIGHT;
}

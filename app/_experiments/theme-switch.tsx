"use client";
/// The console's theme switch on the experiments pages (same stored choice, Alt+T too).
import { useEffect } from "react";
import { useTheme } from "@/app/_console/theme";
import { buttonSecondary } from "@/app/_console/views/styles";

export function ThemeSwitch() {
  const { theme, toggle } = useTheme();
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.altKey && !e.ctrlKey && !e.metaKey && e.code === "KeyT") {
        e.preventDefault();
        toggle();
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [toggle]);
  return (
    <button type="button" className={buttonSecondary} onClick={toggle} aria-pressed={theme === "dark"} title="Switch theme (Alt+T)">
      {theme === "dark" ? "Light" : "Dark"}
    </button>
  );
}

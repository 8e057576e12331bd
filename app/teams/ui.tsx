"use client";
/// Small pieces shared by the team and invitation pages: the page frame and a notice line
/// (the JSON fetch `api` is app/_client/fetch.ts, re-exported for these pages).
import Link from "next/link";
import type { ReactNode } from "react";
export { api } from "../_client/fetch";

export function PageFrame({ title, children, back = true }: { title: string; children: ReactNode; back?: boolean }) {
  return (
    <main className="mx-auto max-w-3xl p-8 text-ink dark:text-paper">
      <div className="flex items-baseline justify-between">
        <h1 className="font-mono text-lg font-semibold tracking-tight">{title}</h1>
        {back && (
          <nav className="flex gap-4 text-sm text-ink-soft">
            <Link href="/teams" className="underline">
              Teams
            </Link>
            <Link href="/" className="underline">
              Back to the console
            </Link>
          </nav>
        )}
      </div>
      {children}
    </main>
  );
}

export function Notice({ text, tone }: { text: string | null; tone: "ok" | "error" }) {
  if (!text) return null;
  return (
    <p
      role={tone === "error" ? "alert" : "status"}
      data-testid="team-notice"
      className={`mt-4 rounded px-3 py-2 text-sm ${tone === "error" ? "bg-signal-soft text-ink" : "bg-paper-deep text-ink"}`}
    >
      {text}
    </p>
  );
}

export const inputClass = "rounded border border-ink/20 bg-white px-2 py-1 text-sm dark:border-paper/20 dark:bg-night-panel";
export const buttonClass =
  "rounded bg-ink px-3 py-1 text-sm font-medium text-paper hover:bg-ink/80 disabled:opacity-50 dark:bg-paper dark:text-ink";
export const quietButtonClass =
  "rounded border border-ink/20 px-2 py-0.5 text-xs hover:bg-paper-deep disabled:opacity-50 dark:border-paper/20";

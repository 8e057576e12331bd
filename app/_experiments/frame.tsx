/// The page frame of the experiments pages: the product's name, navigation back to the
/// console and to the list, the theme switch, and the finished-experiment notices.
import Link from "next/link";
import type { ReactNode } from "react";
import { FinishWatcher } from "./finish-watcher";
import { ThemeSwitch } from "./theme-switch";

export function ExperimentsFrame({ userName, children }: { userName: string | null; children: ReactNode }) {
  const nav = "text-ink-soft underline underline-offset-2 dark:text-paper/70";
  return (
    <div className="flex min-h-screen flex-col bg-paper text-ink dark:bg-night dark:text-paper">
      <header className="flex flex-wrap items-center justify-between gap-3 border-b border-ink/10 bg-white px-5 py-3 dark:border-paper/10 dark:bg-night-panel">
        <p className="font-mono text-lg font-semibold tracking-tight">
          Ringside<span className="text-signal">.</span>{" "}
          <span className="text-sm font-normal text-ink-soft dark:text-paper/60">experiments</span>
        </p>
        <nav className="flex items-center gap-4 text-sm">
          {userName !== null && (
            <>
              <Link href="/" className={nav}>
                Console
              </Link>
              <Link href="/experiments" className={nav}>
                All experiments
              </Link>
              <span className="font-medium" data-testid="user-name">
                {userName}
              </span>
              <Link href="/sign-out" className={nav}>
                Sign out
              </Link>
            </>
          )}
          {userName === null && <span className="text-ink-soft dark:text-paper/70">Visiting through a read-only link</span>}
          <ThemeSwitch />
        </nav>
      </header>
      <main className="flex min-w-0 flex-1 flex-col">{children}</main>
      {userName !== null && <FinishWatcher />}
    </div>
  );
}

/// Words and numbers of the progress line: rate and time left. Pure functions.

/// "4.2 members/s", "12 members/min" for slow experiments, or "—" before the first row.
export function formatRate(rate: number | null): string {
  if (rate === null || !Number.isFinite(rate) || rate <= 0) return "—";
  if (rate < 1) return `${(rate * 60).toFixed(rate * 60 < 10 ? 1 : 0)} members/min`;
  return `${rate.toFixed(rate < 10 ? 1 : 0)} members/s`;
}

/// "about 40 s", "about 3 min 05 s", "about 2 h 10 min"; "—" when unknown.
export function formatEta(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return "—";
  const s = Math.max(0, Math.round(seconds));
  if (s < 60) return `about ${s} s`;
  if (s < 3600) return `about ${Math.floor(s / 60)} min ${String(s % 60).padStart(2, "0")} s`;
  return `about ${Math.floor(s / 3600)} h ${String(Math.floor((s % 3600) / 60)).padStart(2, "0")} min`;
}

/// A safe file name stem from an experiment's title and id.
export function fileStem(title: string, id: string): string {
  const words = title
    .replace(/[^A-Za-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40);
  return `${words || "experiment"}-${id.slice(0, 8)}`;
}

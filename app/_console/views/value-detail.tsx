"use client";
/// The control under a value stored as a summary (its whole JSON above `largeValueBytes`):
/// says how large the whole value is, loads it into the page on request (SWR, fetched once),
/// or downloads it as a JSON file; a refusal (404 deleted or not on this server, 403 no
/// longer allowed, 401 signed out) is said in words. `draw` draws the loaded value (the
/// caller's ValueView, passed in so the two files do not import each other).
import { useState, type ReactNode } from "react";
import useSWR from "swr";
import { ApiError, errorOf, fetchJson } from "@/app/_client/fetch";
import type { ValueReading } from "@/lib/wire/reading";
import { detailFileName, detailProblem, formatBytes, HEAVY_TO_DRAW_BYTES, type DetailMarker } from "../render/detail";
import { buttonQuiet } from "./styles";

function problemOf(e: unknown): string {
  if (e instanceof ApiError) return detailProblem(e.status, e.message);
  return detailProblem(0, e instanceof Error ? e.message : undefined);
}

/// Saves `blob` under `name` through a temporary link (the page's own origin, no new window).
function saveBlob(blob: Blob, name: string) {
  const href = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
}

export function ValueDetail({
  marker,
  address,
  draw,
}: {
  marker: DetailMarker;
  /// where the whole value is served (null where it cannot be fetched, e.g. outside a session)
  address: string | null;
  draw: (whole: ValueReading) => ReactNode;
}) {
  const [open, setOpen] = useState(false);
  const [downloading, setDownloading] = useState(false);
  const [downloadProblem, setDownloadProblem] = useState<string | null>(null);
  // Fetched once and kept: the detail behind an id never changes (it is named by its content).
  const whole = useSWR<ValueReading>(open && address ? address : null, fetchJson, {
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
    revalidateIfStale: false,
    shouldRetryOnError: false,
  });
  const size = formatBytes(marker.bytes);
  const heavy = marker.bytes > HEAVY_TO_DRAW_BYTES;

  async function download() {
    if (!address) return;
    setDownloading(true);
    setDownloadProblem(null);
    try {
      const res = await fetch(address, { headers: { accept: "application/json" } });
      if (!res.ok) throw await errorOf(res);
      saveBlob(await res.blob(), detailFileName(marker));
    } catch (e) {
      setDownloadProblem(problemOf(e));
    } finally {
      setDownloading(false);
    }
  }

  const problem = (open && whole.error ? problemOf(whole.error) : null) ?? downloadProblem;
  return (
    <div className="mt-1 flex flex-col gap-1" data-testid="value-detail" data-detail-id={marker.id}>
      <div className="flex flex-wrap items-center gap-2 text-xs text-ink-soft dark:text-paper/70">
        <span data-testid="value-detail-size">
          Shown as a summary; the full {marker.type} takes {size}.
        </span>
        {address ? (
          <>
            <button
              type="button"
              className={`${buttonQuiet} underline`}
              aria-expanded={open}
              onClick={() => setOpen((o) => !o)}
              title={heavy ? "Drawing a value this large may make the page slow; downloading it does not." : undefined}
            >
              {open ? "Hide the full value" : `Load the full value (${size})`}
            </button>
            <button type="button" className={`${buttonQuiet} underline`} disabled={downloading} onClick={() => void download()}>
              {downloading ? "Downloading…" : "Download as JSON"}
            </button>
          </>
        ) : (
          <span>The full value can be fetched from the session it belongs to.</span>
        )}
      </div>
      {open && heavy && !whole.data && !whole.error && (
        <p className="text-xs text-ink-soft dark:text-paper/70">Loading {size}: drawing a value this large may take a while.</p>
      )}
      {open && whole.isLoading && (
        <p className="text-xs text-ink-soft dark:text-paper/70" role="status">
          Loading the full value…
        </p>
      )}
      {problem && (
        <p role="alert" className="text-xs text-red-700 dark:text-red-300" data-testid="value-detail-problem">
          {problem}
        </p>
      )}
      {open && whole.data && (
        <div className="rounded border border-ink/10 p-2 dark:border-paper/10" data-testid="value-detail-whole">
          {draw(whole.data)}
        </div>
      )}
    </div>
  );
}

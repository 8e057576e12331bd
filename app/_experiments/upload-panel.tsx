"use client";
/// Sweep a family file: drop it here or choose it; the server reads it (a dry run that
/// stores nothing) and the first members appear typeset, or every bad line with its number
/// and reason. Only a file without bad lines can become an experiment, in a session I may edit.
import { useRouter } from "next/navigation";
import { useRef, useState, type DragEvent } from "react";
import useSWR from "swr";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { keys } from "@/app/_console/api/client";
import type { SessionSummary } from "@/lib/wire/reading";
import { buttonPrimary, buttonSecondary, focusRing, panelHeading, textInput } from "@/app/_console/views/styles";
import { ValueView } from "@/app/_console/views/value-view";
import { createFromUpload, createUpload, previewUpload } from "./api";
import type { UploadPreview } from "./types";

const MAX_BYTES = 2 * 1024 * 1024;

/// A name for the family from the file's name: an identifier of the notation.
export function nameFromFile(file: string): string {
  const stem = file
    .replace(/\.[^.]*$/, "")
    .replace(/[^A-Za-z0-9_]+/g, "_")
    .replace(/^[^A-Za-z]+/, "");
  return stem.slice(0, 40) || "uploaded";
}

export function UploadPanel() {
  const sessions = useSWR<{ sessions: SessionSummary[] }>(keys.sessions, fetchJson);
  const editable = (sessions.data?.sessions ?? []).filter((s) => s.access !== "viewer");
  const [file, setFile] = useState<{ name: string; content: string } | null>(null);
  const [ring, setRing] = useState("Q[x, y, z]");
  const [format, setFormat] = useState<"text" | "json">("text");
  const [preview, setPreview] = useState<UploadPreview | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [over, setOver] = useState(false);
  const [sessionId, setSessionId] = useState("");
  const [name, setName] = useState("uploaded");
  const [probe, setProbe] = useState("I -> {codim: I.codim, degree: I.degree, pd: (S / I).pd}");
  const picker = useRef<HTMLInputElement>(null);
  const router = useRouter();

  const read = async (f: File) => {
    setProblem(null);
    setPreview(null);
    if (f.size > MAX_BYTES) return setProblem(`${f.name} has ${f.size} bytes; a family file may have at most 2 MiB.`);
    const content = await f.text();
    const fmt = /\.json$/i.test(f.name) ? "json" : "text";
    setFormat(fmt);
    setFile({ name: f.name, content });
    setName(nameFromFile(f.name));
    await check({ content }, fmt, ring);
  };

  const check = async (f: { content: string } | null, fmt: "text" | "json", r: string) => {
    if (!f) return;
    setBusy(true);
    setProblem(null);
    try {
      setPreview((await previewUpload({ format: fmt, ring: r, content: f.content })).preview);
    } catch (e) {
      setPreview(null);
      setProblem(messageOf(e));
    } finally {
      setBusy(false);
    }
  };

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault();
    setOver(false);
    const f = e.dataTransfer.files[0];
    if (f) void read(f);
  };

  const create = async () => {
    if (!file || !preview || preview.problemCount > 0) return;
    const target = sessionId || editable[0]?.id;
    if (!target) return setProblem("You have no session you may edit: create one in the console first.");
    setBusy(true);
    setProblem(null);
    try {
      const { upload } = await createUpload({ sessionId: target, name, format, ring, content: file.content });
      const { experiment } = await createFromUpload({ sessionId: target, uploadId: upload.id, probe });
      router.push(`/experiments/${experiment.id}`);
    } catch (e) {
      setProblem(messageOf(e));
      setBusy(false);
    }
  };

  const bad = preview !== null && preview.problemCount > 0;
  return (
    <section
      aria-labelledby="upload-heading"
      className="flex min-w-0 flex-col gap-3 rounded-md border border-ink/10 bg-white/60 p-4 dark:border-paper/10 dark:bg-night-panel/60"
    >
      <h2 id="upload-heading" className="text-base font-semibold">
        Sweep a family file
      </h2>
      <p className="text-sm text-ink-soft dark:text-paper/70">
        A text file with one ideal per line such as <code className="font-mono">&lt;x^2, y*z&gt;</code> (blank lines and # comments
        allowed), or a JSON list of generator lists. Nothing is stored until you create the experiment.
      </p>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={onDrop}
        data-testid="drop-zone"
        className={`flex flex-wrap items-center gap-3 rounded-md border-2 border-dashed px-4 py-5 text-sm ${over ? "border-signal bg-signal-soft/30" : "border-ink/25 dark:border-paper/25"}`}
      >
        <span>{file ? `${file.name} (${format})` : "Drop a family file here, or"}</span>
        <button type="button" className={buttonSecondary} onClick={() => picker.current?.click()}>
          Choose a file…
        </button>
        <input
          ref={picker}
          type="file"
          accept=".txt,.json,.fam,text/plain,application/json"
          className="sr-only"
          aria-label="Family file"
          tabIndex={-1}
          onChange={(e) => e.target.files?.[0] && void read(e.target.files[0])}
        />
      </div>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <label className="flex flex-col gap-1 text-sm">
          <span className={panelHeading}>Ring the ideals are read in</span>
          <span className="flex gap-2">
            <input className={`${textInput} font-mono`} value={ring} onChange={(e) => setRing(e.target.value)} aria-label="Ring" />
            <button
              type="button"
              className={`${buttonSecondary} whitespace-nowrap`}
              disabled={!file || busy}
              onClick={() => void check(file, format, ring)}
            >
              Check again
            </button>
          </span>
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className={panelHeading}>Format</span>
          <select className={textInput} value={format} onChange={(e) => setFormat(e.target.value as "text" | "json")} aria-label="Format">
            <option value="text">text: one ideal per line</option>
            <option value="json">JSON: a list of generator lists</option>
          </select>
        </label>
      </div>
      {busy && <p className="text-sm text-ink-soft">Reading the file…</p>}
      {problem && (
        <p role="alert" className="text-sm text-red-700 dark:text-red-300" data-testid="upload-problem">
          {problem}
        </p>
      )}
      {bad && (
        <div role="alert" className="flex flex-col gap-1" data-testid="upload-problems">
          <p className="text-sm font-medium text-red-800 dark:text-red-200">
            {preview.problemCount} bad {preview.unit}
            {preview.problemCount === 1 ? "" : "s"}; nothing was created. Fix {preview.problemCount === 1 ? "it" : "them"} and choose the
            file again.
          </p>
          <ol className="max-h-60 overflow-y-auto rounded bg-red-50 px-3 py-2 font-mono text-xs text-red-900 dark:bg-red-900/30 dark:text-red-100">
            {preview.problems.map((p, k) => (
              <li key={k} data-line={p.line}>
                {p.line === 0 ? p.message : `${preview.unit} ${p.line}: ${p.message}`}
              </li>
            ))}
            {preview.problemCount > preview.problems.length && <li>… and {preview.problemCount - preview.problems.length} more</li>}
          </ol>
        </div>
      )}
      {preview && !bad && (
        <div className="flex flex-col gap-2" data-testid="upload-preview">
          <p className="text-sm">
            {preview.count} members read. {preview.members.length < preview.count ? `The first ${preview.members.length}:` : "All of them:"}
          </p>
          <ol className="flex max-h-72 flex-col gap-1 overflow-y-auto rounded border border-ink/10 p-2 dark:border-paper/10">
            {preview.members.map((m) => (
              <li key={m.line} className="flex items-start gap-2">
                <span className="w-16 shrink-0 text-right font-mono text-xs text-ink-soft dark:text-paper/60">
                  {preview.unit} {m.line}
                </span>
                <ValueView value={m.value} />
              </li>
            ))}
          </ol>
          <div className="grid grid-cols-1 gap-3 md:grid-cols-3">
            <label className="flex flex-col gap-1 text-sm">
              <span className={panelHeading}>Session</span>
              <select
                className={textInput}
                value={sessionId || editable[0]?.id || ""}
                onChange={(e) => setSessionId(e.target.value)}
                aria-label="Session"
              >
                {editable.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.title}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1 text-sm">
              <span className={panelHeading}>Name of the family</span>
              <input
                className={`${textInput} font-mono`}
                value={name}
                onChange={(e) => setName(e.target.value)}
                aria-label="Name of the family"
              />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              <span className={panelHeading}>Probe (S is the ring)</span>
              <input className={`${textInput} font-mono`} value={probe} onChange={(e) => setProbe(e.target.value)} aria-label="Probe" />
            </label>
          </div>
          <div>
            <button
              type="button"
              className={`${buttonPrimary} ${focusRing}`}
              disabled={busy || editable.length === 0}
              onClick={() => void create()}
            >
              Create the experiment
            </button>
          </div>
        </div>
      )}
    </section>
  );
}

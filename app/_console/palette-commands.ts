/// The command palette's commands as data: what the console can do right now, from who
/// the visitor is and what is open. A pure function of its context, so the list can be
/// read (and tested) without drawing the console.
import { GUIDED_TOUR, type GuidedExample } from "@/lib/examples/tour";
import type { NamedObject, SessionSummary } from "@/lib/wire/reading";
import type { ExportFormat } from "./api/client";
import { EXPORT_LABEL } from "./transcript-export";
import type { DialogName } from "./use-console";
import type { PaletteCommand } from "./views/command-palette";

export interface PaletteContext {
  readonly signedIn: boolean;
  readonly canEdit: boolean;
  readonly canShare: boolean;
  readonly sessionId: string | null;
  readonly running: boolean;
  readonly theme: "light" | "dark";
  readonly sessions: readonly SessionSummary[];
  readonly objects: readonly NamedObject[];
  readonly actions: {
    readonly newSession: () => void;
    readonly openDialog: (d: Exclude<DialogName, null>) => void;
    readonly toggleTheme: () => void;
    readonly exportTranscript: (format: ExportFormat) => void;
    readonly shareObject: (o: NamedObject) => void;
    readonly runInput: () => void;
    readonly cancelRunning: () => void;
    readonly insertExample: (e: GuidedExample) => void;
    readonly openSession: (id: string) => void;
    readonly insertName: (name: string) => void;
    /// leaves the console (the sign-in and Teams pages)
    readonly goTo: (path: string) => void;
    readonly openInNewTab: (path: string) => void;
  };
}

export function paletteCommands(c: PaletteContext): PaletteCommand[] {
  const a = c.actions;
  const list: PaletteCommand[] = [
    // a signed-out link visitor has no sessions of their own: the command sends them to sign in
    {
      id: "new-session",
      group: "Session",
      label: c.signedIn ? "New session" : "New session (sign in first)",
      shortcut: "Alt+N",
      run: () => (c.signedIn ? a.newSession() : a.goTo("/sign-in")),
    },
    {
      id: "transfer",
      group: "Session",
      label: c.signedIn ? "Export or import…" : "Export the transcript…",
      shortcut: "Alt+E",
      run: () => a.openDialog("transfer"),
    },
    { id: "history", group: "Input", label: "Search the input history", shortcut: "Alt+R", run: () => a.openDialog("history") },
    {
      id: "tour",
      group: "Help",
      label: "Guided first steps",
      shortcut: "Alt+G",
      keywords: ["examples", "tour"],
      run: () => a.openDialog("tour"),
    },
    {
      id: "help",
      group: "Help",
      label: "Keyboard help",
      shortcut: "Alt+/",
      keywords: ["shortcuts", "keys"],
      run: () => a.openDialog("help"),
    },
    {
      id: "reference",
      group: "Help",
      label: "Open the notation reference",
      keywords: ["functions", "properties"],
      run: () => a.openInNewTab("/reference"),
    },
    {
      id: "theme",
      group: "View",
      label: c.theme === "dark" ? "Switch to the light theme" : "Switch to the dark theme",
      shortcut: "Alt+T",
      run: a.toggleTheme,
    },
  ];
  if (c.sessionId) {
    list.push({
      id: "export-cells",
      group: "Export",
      label: "Export the transcript, choosing cells…",
      keywords: ["download", "markdown", "latex", "json", "errors"],
      run: () => a.openDialog("export"),
    });
    for (const format of ["latex", "markdown", "json"] as const) {
      list.push({
        id: `export-${format}`,
        group: "Export",
        label: `Export the transcript as ${EXPORT_LABEL[format]}`,
        keywords: ["download"],
        run: () => a.exportTranscript(format),
      });
    }
  }
  if (c.signedIn) {
    list.push(
      {
        id: "import-session",
        group: "Session",
        label: "Import a session from a JSON export…",
        keywords: ["upload", "file"],
        run: () => a.openDialog("transfer"),
      },
      {
        id: "library",
        group: "Session",
        label: "Open the library of my objects…",
        keywords: ["find", "insert", "objects", "other sessions", "search"],
        run: () => a.openDialog("library"),
      },
      {
        id: "shared-objects",
        group: "Sharing",
        label: "Objects shared with me…",
        keywords: ["import", "copy"],
        run: () => a.openDialog("shared-objects"),
      },
      {
        id: "teams",
        group: "Sharing",
        label: "Open the Teams page",
        keywords: ["group", "members", "invite"],
        run: () => a.goTo("/teams"),
      },
    );
  }
  if (c.canShare) {
    list.push(
      {
        id: "share",
        group: "Sharing",
        label: "Share this session…",
        keywords: ["team", "viewer", "editor"],
        run: () => a.openDialog("share"),
      },
      {
        id: "link",
        group: "Sharing",
        label: "Publish or revoke the read-only link…",
        keywords: ["url", "public"],
        run: () => a.openDialog("share"),
      },
    );
    for (const o of c.objects) {
      list.push({ id: `share-object-${o.id}`, group: "Sharing", label: `Share named object: ${o.name}`, run: () => a.shareObject(o) });
    }
  }
  if (c.canEdit) {
    list.splice(2, 0, { id: "run", group: "Input", label: "Run the input", shortcut: "Enter", run: a.runInput });
    if (c.running)
      list.splice(3, 0, { id: "cancel", group: "Input", label: "Cancel the running cell", shortcut: "Alt+X", run: a.cancelRunning });
    for (const e of GUIDED_TOUR) {
      list.push({
        id: `example-${e.id}`,
        group: "Insert a guided example",
        label: `Insert example: ${e.title}`,
        keywords: [e.computes],
        run: () => a.insertExample(e),
      });
    }
  }
  for (const s of c.sessions) {
    list.push({
      id: `open-${s.id}`,
      group: "Open session",
      label: `Open session: ${s.title}`,
      keywords: [s.ownerName],
      run: () => a.openSession(s.id),
    });
  }
  for (const o of c.objects) {
    list.push({
      id: `object-${o.id}`,
      group: "Recall a named object",
      label: `Insert name: ${o.name} (${o.type})`,
      keywords: [o.summary],
      run: () => a.insertName(o.name),
    });
  }
  return list;
}

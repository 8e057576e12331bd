// The palette's commands as data (app/_console/palette-commands.ts): what a visitor is
// offered depends on who they are and what is open (app/_console/README.md).
import { describe, expect, it } from "vitest";
import { paletteCommands, type PaletteContext } from "@/app/_console/palette-commands";
import { GUIDED_TOUR } from "@/lib/examples/tour";

const calls: string[] = [];
const context = (over: Partial<PaletteContext>): PaletteContext => ({
  signedIn: true,
  canEdit: true,
  canShare: false,
  sessionId: "s1",
  running: false,
  theme: "light",
  sessions: [],
  objects: [],
  actions: {
    newSession: () => calls.push("new"),
    openDialog: (d) => calls.push(`dialog:${d}`),
    toggleTheme: () => calls.push("theme"),
    exportTranscript: (f) => calls.push(`export:${f}`),
    shareObject: (o) => calls.push(`share:${o.name}`),
    runInput: () => calls.push("run"),
    cancelRunning: () => calls.push("cancel"),
    insertExample: (e) => calls.push(`example:${e.id}`),
    openSession: (id) => calls.push(`open:${id}`),
    insertName: (n) => calls.push(`name:${n}`),
    goTo: (p) => calls.push(`go:${p}`),
    openInNewTab: (p) => calls.push(`tab:${p}`),
  },
  ...over,
});
const ids = (c: PaletteContext) => paletteCommands(c).map((x) => x.id);

describe("palette commands", () => {
  it("offers an editor Run third and Cancel fourth while a cell runs, and every guided example", () => {
    const list = ids(context({ running: true }));
    expect(list.slice(0, 4)).toEqual(["new-session", "transfer", "run", "cancel"]);
    for (const e of GUIDED_TOUR) expect(list).toContain(`example-${e.id}`);
  });

  it("offers a signed-out link visitor no running, importing or sharing, and sends New session to sign-in", () => {
    const c = context({ signedIn: false, canEdit: false });
    const list = ids(c);
    for (const absent of ["run", "cancel", "import-session", "shared-objects", "teams", "share"]) expect(list).not.toContain(absent);
    expect(list).toContain("export-json");
    calls.length = 0;
    paletteCommands(c)[0].run();
    expect(calls).toEqual(["go:/sign-in"]);
  });

  it("offers sharing only to who may manage it", () => {
    expect(ids(context({ canShare: false }))).not.toContain("share");
    expect(ids(context({ canShare: true }))).toEqual(expect.arrayContaining(["share", "link"]));
  });
});

/// A read-only link's token reaches every API address the console makes for the session
/// it was given for (issue 8): the SWR keys and the export address carry `link=`.
import { describe, expect, it } from "vitest";
import { exportUrl, keys } from "@/app/_console/api/client";
import { withLink } from "@/app/_client/fetch";

const ID = "0b7e2c1a-4d5f-4e61-9a8b-7c6d5e4f3a21";
const TOKEN = "Qm-9_zK+/=x";

describe("link token in API addresses", () => {
  it("is appended as ?link= or &link=, URL-encoded, and left out without a token", () => {
    expect(withLink("/api/sessions/x", TOKEN)).toBe(`/api/sessions/x?link=${encodeURIComponent(TOKEN)}`);
    expect(withLink("/api/x?format=json", TOKEN)).toBe(`/api/x?format=json&link=${encodeURIComponent(TOKEN)}`);
    expect(withLink("/api/sessions/x", null)).toBe("/api/sessions/x");
  });

  it("is part of the session, cells, objects and export addresses", () => {
    for (const url of [keys.session(ID, TOKEN), keys.cells(ID, TOKEN), keys.objects(ID, TOKEN), exportUrl(ID, "latex", TOKEN)]) {
      const parsed = new URL(url, "http://ringside.invalid");
      expect(parsed.pathname.startsWith(`/api/sessions/${ID}`)).toBe(true);
      expect(parsed.searchParams.get("link")).toBe(TOKEN);
    }
    expect(new URL(exportUrl(ID, "latex", TOKEN), "http://ringside.invalid").searchParams.get("format")).toBe("latex");
    // without a link, the keys are the plain addresses SWR shares with the rest of the console
    expect(keys.cells(ID)).toBe(`/api/sessions/${ID}/cells`);
    expect(keys.session(ID, TOKEN)).not.toBe(keys.session(ID));
  });
});

// The "wait" preference of POST /api/v1/retrofits/:id/revisions.
// Source: RFC 7240 (Prefer Header for HTTP), section 2 (syntax: preferences
// separated by ",", parameters by ";") and section 4.3 (the "wait" preference,
// e.g. "Prefer: respond-async, wait=100").
import { describe, expect, it } from "vitest";
import { wantsWait } from "@/lib/api/prefer-wait";

const req = (query = "", prefer?: string) =>
  new Request(`http://x/api/v1/retrofits/1/revisions${query}`, {
    method: "POST",
    headers: prefer === undefined ? {} : { prefer },
  });

describe("wantsWait", () => {
  it("waits for ?wait=1 or ?wait=true only", () => {
    expect(wantsWait(req("?wait=1"))).toBe(true);
    expect(wantsWait(req("?wait=true"))).toBe(true);
    expect(wantsWait(req("?wait=0"))).toBe(false);
    expect(wantsWait(req())).toBe(false);
  });

  it("reads the wait preference as RFC 7240 writes it", () => {
    expect(wantsWait(req("", "wait=100"))).toBe(true); // section 4.3
    expect(wantsWait(req("", "respond-async, wait=100"))).toBe(true); // section 4.3 example
    expect(wantsWait(req("", "Wait"))).toBe(true); // preference names are case-insensitive (section 2)
    expect(wantsWait(req("", "handling=lenient; wait=5"))).toBe(false); // a parameter, not a preference
    expect(wantsWait(req("", "respond-async"))).toBe(false);
    expect(wantsWait(req("", "waiting=1"))).toBe(false);
  });
});

// Forged cookie mutations are refused (issue 15 point 2). Rules from the
// Fetch Metadata Request Headers spec (Sec-Fetch-Site values) and RFC 6454
// section 7 (Origin); a form can only send urlencoded, multipart or text/plain
// bodies (HTML standard, form submission), so JSON cannot be forged by a form.
import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/api/errors";
import { checkCookieMutation } from "@/lib/api/same-origin";

const COOKIE = "next-auth.session-token=abc";
const req = (headers: Record<string, string>, method = "POST") =>
  new Request("http://127.0.0.1:3360/api/v1/invitations", {
    method,
    headers: { host: "127.0.0.1:3360", ...headers },
  });
const refusal = (r: Request) => {
  try {
    checkCookieMutation(r);
    return null;
  } catch (e) {
    return e instanceof ApiError ? e.code : "other";
  }
};

describe("cookie mutations", () => {
  it("refuses another port's form (text/plain, Sec-Fetch-Site same-site)", () => {
    expect(
      refusal(req({ cookie: COOKIE, "sec-fetch-site": "same-site", "content-type": "text/plain" })),
    ).toBe("forbidden");
    expect(
      refusal(req({ cookie: COOKIE, origin: "http://127.0.0.1:3361", "content-type": "application/json" })),
    ).toBe("forbidden");
    expect(refusal(req({ cookie: COOKIE, "content-type": "application/json" }))).toBe("forbidden");
  });
  it("refuses a same-origin request whose body is not JSON with 415 (RFC 9110 section 15.5.16)", () => {
    for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"])
      expect(refusal(req({ cookie: COOKIE, "sec-fetch-site": "same-origin", "content-type": type }))).toBe(
        "unsupported_media_type",
      );
    expect(new ApiError("unsupported_media_type", "x").status).toBe(415);
  });
  it("accepts our own pages' JSON, bearer tokens, signed-out requests and reads", () => {
    expect(
      refusal(req({ cookie: COOKIE, "sec-fetch-site": "same-origin", "content-type": "application/json" })),
    ).toBeNull();
    expect(
      refusal(
        req({
          cookie: COOKIE,
          origin: "http://127.0.0.1:3360",
          "content-type": "application/json; charset=utf-8",
        }),
      ),
    ).toBeNull();
    expect(
      refusal(req({ cookie: COOKIE, authorization: "Bearer cgt_x", "content-type": "text/plain" })),
    ).toBeNull();
    expect(refusal(req({ "content-type": "text/plain" }))).toBeNull();
    expect(refusal(req({ cookie: COOKIE, "sec-fetch-site": "cross-site" }, "GET"))).toBeNull();
  });
});

// Sign-in, session and the role gate, against the running server and the real
// test database.
import { describe, expect, it } from "vitest";
import { Session, signedIn } from "../helpers/server";
import { makeToken, makeUser, TEST_PASSWORD } from "../helpers/users";
import { SIGN_IN_ERRORS } from "@/lib/auth/options";
import { THROTTLE_RULES } from "@/lib/auth/throttle";

describe("sign-in and roles", () => {
  it("answers an unauthenticated API call with 401 JSON in the error shape", async () => {
    const res = await new Session().json<{ error: { code: string; message: string } }>("/api/v1/users");
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("unauthenticated");
    expect(res.body.error.message).toMatch(/sign in/i);
  });

  it("answers a wrong role with 403 JSON", async () => {
    const tech = await makeUser("technician");
    const s = await signedIn(tech.email, TEST_PASSWORD);
    const res = await s.json<{ error: { code: string } }>("/api/v1/users");
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
  });

  it("lets an admin list users without password hashes", async () => {
    const admin = await makeUser("admin");
    const s = await signedIn(admin.email, TEST_PASSWORD);
    const res = await s.json<{ users: Record<string, unknown>[] }>("/api/v1/users");
    expect(res.status).toBe(200);
    expect(res.body.users.some((u) => u.email === admin.email)).toBe(true);
    expect(JSON.stringify(res.body)).not.toMatch(/password|\$2[aby]\$/);
  });

  it("refuses a wrong password with a clear message and no session", async () => {
    const eng = await makeUser("engineer");
    const s = new Session();
    const error = await s.signIn(eng.email, "not-the-password");
    expect(error).toBe(SIGN_IN_ERRORS.invalid);
    expect(await s.user()).toBeNull();
  });

  it("gives an unknown e-mail the same message as a wrong password", async () => {
    const error = await new Session().signIn("nobody-here@test.invalid", "whatever-1");
    expect(error).toBe(SIGN_IN_ERRORS.invalid);
  });

  it("carries the role in the session", async () => {
    const rev = await makeUser("reviewer");
    const s = await signedIn(rev.email, TEST_PASSWORD);
    expect(await s.user()).toMatchObject({ email: rev.email, role: "reviewer" });
  });

  it("refuses a disabled account with the wrong-password answer, which names both causes", async () => {
    const u = await makeUser("engineer", { disabled: true });
    expect(await new Session().signIn(u.email, TEST_PASSWORD)).toBe(SIGN_IN_ERRORS.invalid);
    expect(SIGN_IN_ERRORS.invalid).toMatch(/disabled/);
  });

  it("slows an e-mail and address after repeated failures, even with the right password", async () => {
    const u = await makeUser("engineer");
    for (let i = 0; i < THROTTLE_RULES.pair.free; i++) await new Session().signIn(u.email, "wrong-" + i);
    expect(await new Session().signIn(u.email, TEST_PASSWORD)).toMatch(/Too many failed attempts/);
  });

  it("accepts a personal API token as Bearer and refuses a made-up one", async () => {
    const admin = await makeUser("admin");
    const token = await makeToken(admin.id);
    const ok = await fetch(new Session().base + "/api/v1/users", {
      headers: { authorization: `Bearer ${token}` },
    });
    expect(ok.status).toBe(200);
    const bad = await fetch(new Session().base + "/api/v1/users", {
      headers: { authorization: `Bearer cgt_${"x".repeat(43)}` },
    });
    expect(bad.status).toBe(401);
  });

  it("sends signed-out page visits to the sign-in page", async () => {
    const res = await new Session().fetch("/retrofits");
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toMatch(/\/sign-in/);
  });
});

// After an invitation is accepted the set-password form sends the new user to
// /sign-in?email=...&welcome=1 (app/(auth)/invite/[token]/set-password-form.tsx).
describe("sign-in page after an accepted invitation", () => {
  it("confirms the account and fills the e-mail it was given", async () => {
    const res = await new Session().fetch("/sign-in?email=new.tech%40example.test&welcome=1");
    const html = await res.text();
    expect(res.status).toBe(200);
    expect(html).toContain('data-testid="invitation-accepted"');
    expect(html).toContain("Sign in with new.tech@example.test");
    expect(html).toMatch(/<input[^>]*name="email"[^>]*value="new.tech@example.test"/);
  });

  it("shows no confirmation and fills nothing for a missing or malformed e-mail", async () => {
    for (const q of ["?welcome=1", "?email=%3Cscript%3E&welcome=1", "?email=a%20b%40c&welcome=1"]) {
      const html = await (await new Session().fetch(`/sign-in${q}`)).text();
      expect(html, q).not.toContain('data-testid="invitation-accepted"');
      expect(html, q).not.toContain("<script>");
      expect(html, q).not.toMatch(/<input[^>]*name="email"[^>]*value="[^"]+"/);
    }
  });
});

// Whether a request asks to wait for slow work to finish instead of getting
// 202 at once: `?wait=1` (or `true`), or the `wait` preference of the Prefer
// header (RFC 7240 section 4.3: "Prefer: wait=10"; several preferences are
// comma-separated, parameters follow ";"). The number of seconds is not used:
// the wait is bounded by the server's own limit.
export function wantsWait(req: Request): boolean {
  const q = new URL(req.url).searchParams.get("wait");
  if (q === "1" || q === "true") return true;
  const prefer = req.headers.get("prefer") ?? "";
  return prefer
    .split(",")
    .map((p) => p.split(";")[0].trim().toLowerCase())
    .some((token) => token === "wait" || /^wait\s*=/.test(token));
}

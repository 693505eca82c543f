// A field message from inside a "zod/mini" transform: mini transforms get the
// parse payload, not classic zod's ctx.addIssue, so the issue is pushed onto
// it (zod puts the field's path in front as it returns).
import type { core } from "zod/mini";

export function customIssue(ctx: core.ParsePayload, message: string, path?: PropertyKey[]): void {
  ctx.issues.push({ code: "custom", message, input: ctx.value, ...(path ? { path } : {}) });
}

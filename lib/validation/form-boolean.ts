// Checkbox values: real booleans, or the strings forms send. Kept apart from
// ./eng so the retrofit facts schema (and the facts form in the browser) does
// not import the engine.
import * as z from "zod/mini";

export const formBoolean = z.pipe(
  z.optional(z.union([z.boolean(), z.enum(["true", "false", "on", "off", ""])])),
  z.transform(
    (v: boolean | "true" | "false" | "on" | "off" | "" | undefined) =>
      v === true || v === "true" || v === "on",
  ),
);

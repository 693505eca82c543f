// Asset facts of a retrofit: shared by the create/edit forms and the API
// ("zod/mini": the facts form validates with this schema in the browser).
import * as z from "zod/mini";
import { formBoolean } from "./form-boolean";
import { lineText, paragraphText } from "./plain-text";

// Names are one line; the description may span lines (lib/validation/plain-text.ts).
const text = (label: string, max: number) => lineText(label, { max });
const required = (label: string, max: number) => lineText(label, { min: 1, max });
const description = () => paragraphText("Description", { max: 2000 });

export const retrofitFactsSchema = z.object({
  name: required("Name", 120),
  site: required("Site", 120),
  assetTag: required("Asset tag", 60),
  boardRef: z._default(text("Board reference", 120), ""),
  description: z._default(description(), ""),
  mainsPowered: formBoolean,
  drivesThyristor: formBoolean,
});

export type RetrofitFactsInput = z.input<typeof retrofitFactsSchema>;
export type RetrofitFacts = z.output<typeof retrofitFactsSchema>;

/** Partial facts for PATCH: only the fields sent are changed. */
export const retrofitFactsPatchSchema = z.object({
  name: z.optional(required("Name", 120)),
  site: z.optional(required("Site", 120)),
  assetTag: z.optional(required("Asset tag", 60)),
  boardRef: z.optional(text("Board reference", 120)),
  description: z.optional(description()),
  mainsPowered: z.optional(z.boolean()),
  drivesThyristor: z.optional(z.boolean()),
});

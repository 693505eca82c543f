// Asset facts of a retrofit: shared by the create/edit forms and the API.
import { z } from "zod";
import { formBoolean } from "./eng";
import { lineText, paragraphText } from "./plain-text";

// Names are one line; the description may span lines (lib/validation/plain-text.ts).
const text = (label: string, max: number) => lineText(label, { max });
const required = (label: string, max: number) => lineText(label, { min: 1, max });
const description = () => paragraphText("Description", { max: 2000 });

export const retrofitFactsSchema = z.object({
  name: required("Name", 120),
  site: required("Site", 120),
  assetTag: required("Asset tag", 60),
  boardRef: text("Board reference", 120).default(""),
  description: description().default(""),
  mainsPowered: formBoolean,
  drivesThyristor: formBoolean,
});

export type RetrofitFactsInput = z.input<typeof retrofitFactsSchema>;
export type RetrofitFacts = z.output<typeof retrofitFactsSchema>;

/** Partial facts for PATCH: only the fields sent are changed. */
export const retrofitFactsPatchSchema = z.object({
  name: required("Name", 120).optional(),
  site: required("Site", 120).optional(),
  assetTag: required("Asset tag", 60).optional(),
  boardRef: text("Board reference", 120).optional(),
  description: description().optional(),
  mainsPowered: z.boolean().optional(),
  drivesThyristor: z.boolean().optional(),
});

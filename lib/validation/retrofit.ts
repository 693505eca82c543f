// Asset facts of a retrofit: shared by the create/edit forms and the API.
import { z } from "zod";
import { formBoolean } from "./eng";

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} is required.` })
    .trim()
    .max(max, `${label} is at most ${max} characters.`);

const required = (label: string, max: number) => text(label, max).min(1, `${label} is required.`);

export const retrofitFactsSchema = z.object({
  name: required("Name", 120),
  site: required("Site", 120),
  assetTag: required("Asset tag", 60),
  boardRef: text("Board reference", 120).default(""),
  description: text("Description", 2000).default(""),
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
  description: text("Description", 2000).optional(),
  mainsPowered: z.boolean().optional(),
  drivesThyristor: z.boolean().optional(),
});

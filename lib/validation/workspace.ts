// Bodies of the workspace API: create, update and the stateless plan request.
import { z } from "zod";
import * as zm from "zod/mini";
import { lineText, paragraphText } from "./plain-text";
import { optionalPlainNumber } from "./plain-number";
import { retrofitFactsPatchSchema, retrofitFactsSchema } from "./retrofit";
import { refineControl } from "./control";
import { stageSchema } from "./stage";
import { targetsSchema } from "./target";

// control: the stage's adjustable value (null clears it); it needs the stage beside it.
// The facts, stage and target schemas are "zod/mini" (the browser forms use
// them too); classic zod wraps them here for the server's bodies.
export const createRetrofitSchema = z
  .object({
    ...retrofitFactsSchema.shape,
    stage: z.optional(stageSchema),
    control: z.unknown().optional(),
    targets: z.optional(targetsSchema),
  })
  .transform(refineControl);

export const updateRetrofitSchema = z
  .object({
    ...retrofitFactsPatchSchema.shape,
    stage: z.optional(stageSchema),
    control: z.unknown().optional(),
    targets: z.optional(targetsSchema),
  })
  .transform(refineControl);

export const planBodySchema = z.object({
  stage: stageSchema,
  targets: targetsSchema.check(zm.minLength(1, "Add at least one target.")),
});

export const generateBodySchema = z
  .object({ note: z._default(z.optional(paragraphText("The note", { max: 500 })), "") })
  .optional()
  .default({ note: "" });

export const tokenBodySchema = z.object({
  name: lineText("The token's name", { min: 1, max: 60 }),
});

export const LIST_SORTS = ["name", "site", "assetTag", "kind", "state", "updatedAt"] as const;
import { readState, REVISION_STATES } from "@/lib/review/words";
export { REVISION_STATES };

export const listQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  site: z.string().trim().max(120).optional(),
  kind: z.string().trim().max(40).optional(),
  // Old state values are mapped to ours for one API release (lib/review/words.ts).
  state: z
    .string()
    .trim()
    .transform((v, ctx) => {
      const s = v === "none" ? ("none" as const) : readState(v);
      if (!s) {
        ctx.addIssue({ code: "custom", message: `state is ${REVISION_STATES.join(", ")} or none.` });
        return z.NEVER;
      }
      return s;
    })
    .optional(),
  archived: z.enum(["exclude", "include", "only"]).optional().default("exclude"),
  sort: z
    .enum(LIST_SORTS, { error: `sort is one of ${LIST_SORTS.join(", ")}.` })
    .optional()
    .default("updatedAt"),
  dir: z.enum(["asc", "desc"]).optional().default("desc"),
  page: z._default(
    optionalPlainNumber(
      "page is a whole number from 1",
      z.number().int("page is a whole number.").min(1, "page starts at 1."),
    ),
    1,
  ),
  pageSize: z._default(
    optionalPlainNumber(
      "pageSize is a whole number from 1 to 100",
      z
        .number()
        .int("pageSize is a whole number.")
        .min(1, "pageSize starts at 1.")
        .max(100, "pageSize is at most 100."),
    ),
    20,
  ),
});
export type ListQuery = z.output<typeof listQuerySchema>;

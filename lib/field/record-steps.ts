// Checklist lines sent with a field check: each is a line of the target's own
// CHECKLIST.md, ticked and/or measured, with a note and optionally a photo.
// Measured values of lines with numeric limits are judged here; the bench
// period/high lines take the check's measured period and high time.
import { z } from "zod";
import { ApiError } from "@/lib/api/errors";
import { parseEng } from "@/lib/engine";
import { lineText, paragraphText } from "@/lib/validation/plain-text";
import { checklistSteps, type ChecklistStep } from "./checklist-steps";
import type { CheckLine, StepResult } from "./shapes";

/** A downscaled phone photo stays well under this (common practice, no source). */
export const PHOTO_MAX_BYTES = 1_500_000;
export const PHOTOS_MAX_BYTES = 6_000_000;

const photoSchema = z
  .object({
    mediaType: z.enum(["image/jpeg", "image/png"], { error: "A photo must be a JPEG or PNG image." }),
    base64: z.string().max(Math.ceil((PHOTO_MAX_BYTES * 4) / 3) + 4, "A photo is at most 1.5 MB."),
  })
  .strict();

export const stepInputSchema = z
  .object({
    id: z.string().trim().min(1).max(20),
    done: z.boolean().default(false),
    measured: z._default(lineText("The measured value", { max: 100 }), ""),
    note: z._default(paragraphText("The line's note", { max: 2000 }), ""),
    photo: photoSchema.optional(),
  })
  .strict();

export type StepInput = z.infer<typeof stepInputSchema>;

export type PhotoUpload = { stepId: string; mediaType: string; content: Buffer };

const MAGIC: Record<string, number[]> = {
  // JPEG: SOI marker FF D8 then a marker FF (ITU-T T.81, B.1.1.2); PNG signature (ISO/IEC 15948, 5.2).
  "image/jpeg": [0xff, 0xd8, 0xff],
  "image/png": [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
};

function decodePhoto(id: string, photo: NonNullable<StepInput["photo"]>): Buffer {
  const field = `steps.${id}.photo`;
  const bytes = Buffer.from(photo.base64, "base64");
  if (bytes.toString("base64").replace(/=+$/, "") !== photo.base64.replace(/=+$/, "")) {
    throw new ApiError("bad_request", "The photo is not valid base64.", {
      [field]: "Take or pick the photo again.",
    });
  }
  if (bytes.length > PHOTO_MAX_BYTES) {
    throw new ApiError("bad_request", "A photo is at most 1.5 MB.", {
      [field]: "A photo is at most 1.5 MB.",
    });
  }
  const magic = MAGIC[photo.mediaType];
  if (!magic.every((b, i) => bytes[i] === b)) {
    throw new ApiError(
      "bad_request",
      `The photo is not a ${photo.mediaType === "image/png" ? "PNG" : "JPEG"} image.`,
      {
        [field]: "Pick a JPEG or PNG photo.",
      },
    );
  }
  return bytes;
}

function judgedLine(lines: CheckLine[], target: number, id: "period" | "high") {
  return lines.find((l) => l.target === target && l.id === id);
}

/**
 * The stored result of each checklist line, and the photos to store. Unknown
 * lines, unreadable values and unconfirmed safety steps are refused (400
 * naming `steps.<id>...`); nothing is written by this function.
 */
export function judgeSteps(
  markdown: string,
  inputs: StepInput[],
  judged: { lines: CheckLine[]; target: number },
): { results: StepResult[]; photos: PhotoUpload[]; passed: boolean } {
  const steps = checklistSteps(markdown);
  const byId = new Map(inputs.map((s) => [s.id, s]));
  if (byId.size !== inputs.length) {
    throw new ApiError("bad_request", "A checklist line was sent twice.", { steps: "Send each line once." });
  }
  for (const id of byId.keys()) {
    if (!steps.some((s) => s.id === id)) {
      throw new ApiError("bad_request", `The checklist has no line ${id}.`, {
        [`steps.${id}`]: "Not a line of this checklist.",
      });
    }
  }
  const unconfirmed = steps.filter((s) => s.safety && !byId.get(s.id)?.done);
  if (unconfirmed.length) {
    const fields = Object.fromEntries(
      unconfirmed.map((s) => [`steps.${s.id}.done`, "Confirm this safety step."]),
    );
    throw new ApiError(
      "bad_request",
      `Confirm every safety step before recording (${unconfirmed.map((s) => s.id).join(", ")}).`,
      fields,
    );
  }
  let total = 0;
  const photos: PhotoUpload[] = [];
  const results = steps.map((s): StepResult => {
    const input = byId.get(s.id);
    const base = {
      id: s.id,
      section: s.section,
      text: s.text,
      kind: s.kind,
      expected: s.expected ?? "",
      limits: s.limits ?? "",
      note: input?.note ?? "",
    };
    if (input?.photo) {
      const content = decodePhoto(s.id, input.photo);
      total += content.length;
      if (total > PHOTOS_MAX_BYTES) {
        throw new ApiError("bad_request", "The photos of one check are at most 6 MB together.", {
          [`steps.${s.id}.photo`]: "Leave out a photo or take it smaller.",
        });
      }
      photos.push({ stepId: s.id, mediaType: input.photo.mediaType, content });
    }
    if (s.from) {
      const line = judgedLine(judged.lines, judged.target, s.from);
      return {
        ...base,
        done: true,
        measured: "",
        value: line?.measured ?? null,
        unit: "s",
        pass: line ? line.pass : null,
      };
    }
    if (s.kind === "info" || !input)
      return { ...base, done: false, measured: "", value: null, unit: s.range?.unit ?? "", pass: null };
    let value: number | null = null;
    let pass: boolean | null = input.done ? true : null;
    if (s.range && input.measured) {
      try {
        value = parseEng(input.measured, s.range.unit);
      } catch (e) {
        throw new ApiError("bad_request", `Line ${s.id}: ${(e as Error).message}`, {
          [`steps.${s.id}.measured`]: (e as Error).message,
        });
      }
      pass = value >= s.range.min && value <= s.range.max;
    }
    return {
      ...base,
      done: input.done || value !== null,
      measured: input.measured,
      value,
      unit: s.range?.unit ?? "",
      pass,
    };
  });
  return { results, photos, passed: results.every((r) => r.pass !== false) };
}

export type { ChecklistStep };

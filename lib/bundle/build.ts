// spec -> files. Data flows one way: stage -> analysis -> plans -> files.
// Nothing here reads the clock, a random source or object key order.
import { analyzeStage, ENGINE_VERSION, EngineError, isEngineError, planTarget } from "@/lib/engine";
import { controlOnTarget } from "./adc-control";
import { TRIM_DEVICES, trimOnTarget } from "./trim-control";
import { buildRefusal } from "./buildable";
import { DEVICES } from "./devices";
import { targetFolders } from "./folders";
import { avrTriggerView } from "./trigger-avr";
import { rp2040TriggerView } from "./trigger-rp2040";
import { stm32g031TriggerView } from "./trigger-stm32g031";
import { pic12f1840TriggerView } from "./trigger-pic12f1840";
import { msp430g2553TriggerView } from "./trigger-msp430g2553";
import { triggerDoc } from "./trigger-doc";
import { sha256Hex } from "./hash";
import { checklistLimits, limitBasis } from "./limits";
import { oldOutputNote } from "./old-output";
import { stableJson } from "./plan-json";
import { render } from "./render";
import { cautionLines } from "./safety";
import { servicePinsOf } from "./service-pins";
import type { BundleFile, BundlePlan, BundleSpec, BundleTargetRequest, StageAnalysis } from "./types";

/** Devices whose templates make triggered and zero-cross firmware, with the view their template reads as `trigger` (the set itself is TRIGGER_DEVICES in buildable.ts, shared with the live plans). */
export const TRIGGER_VIEWS: Record<string, (plan: BundlePlan) => unknown> = {
  atmega328p: avrTriggerView,
  attiny85: avrTriggerView,
  rp2040: rp2040TriggerView,
  stm32g031: stm32g031TriggerView,
  pic12f1840: pic12f1840TriggerView,
  msp430g2553: msp430g2553TriggerView,
};

export type Planner = (request: BundleTargetRequest) => BundlePlan;

/** Prebuilt images and the toolchains that made them (lib/firmware/bundle.ts builds them). */
export interface BundleImages {
  /** target folder -> its images, paths `<folder>/firmware/<name>` */
  byFolder: Record<string, BundleFile[]>;
  /** "command: first line of --version", sorted */
  toolchains: string[];
}

const sizeOf = (c: string | Uint8Array) => (typeof c === "string" ? Buffer.byteLength(c, "utf8") : c.length);

const byPath = (a: BundleFile, b: BundleFile) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0);

function planAll(spec: BundleSpec, planner: Planner): BundlePlan[] {
  return spec.targets.map((request, index) => {
    let plan: BundlePlan;
    try {
      plan = planner(request);
    } catch (e) {
      const why = e instanceof Error ? e.message : String(e);
      const code = isEngineError(e) ? e.code : "invalid-request";
      throw new EngineError(
        code,
        `target ${index + 1} (${request.device}) cannot be planned: ${why}`,
        `targets.${index}`,
      );
    }
    const refusal = buildRefusal(plan);
    if (refusal)
      throw new EngineError(
        "invalid-request",
        `target ${index + 1} (${request.device}): ${refusal.message}`,
        `targets.${index}`,
      );
    return plan;
  });
}

function analyze(spec: BundleSpec): StageAnalysis | null {
  try {
    return analyzeStage(spec.stage);
  } catch {
    return null;
  }
}

/**
 * Sources, documents and plan.json of a bundle; with `images`, also the
 * prebuilt images (listed in README, CHECKLIST and the checksums).
 * Synchronous and free of toolchains: the golden and browser-free tests use it.
 */
export function buildBundleSourcesWith(
  spec: BundleSpec,
  planner: Planner,
  images: BundleImages | null = null,
): BundleFile[] {
  const plans = planAll(spec, planner);
  const analysis = analyze(spec);
  const folders = targetFolders(spec.targets.map((t) => t.device));
  const cautions = cautionLines(spec.retrofit);
  const retrofit = {
    name: spec.retrofit.name,
    site: spec.retrofit.site ?? "",
    assetTag: spec.retrofit.assetTag ?? "",
    mainsPowered: spec.retrofit.mainsPowered === true,
    drivesThyristor: spec.retrofit.drivesThyristor === true,
  };
  const files: BundleFile[] = [];
  const targets = plans.map((plan, i) => {
    const entry = DEVICES[plan.device];
    if (!entry)
      throw new EngineError(
        "unknown-device",
        `target ${i + 1}: no bundle templates for ${plan.device}`,
        `targets.${i}`,
      );
    const view = entry.view(plan);
    const pct = spec.targets[i]?.requiredTolerancePct;
    const limits = checklistLimits(plan, analysis, {
      requiredRelative: typeof pct === "number" && pct > 0 ? pct / 100 : undefined,
    });
    const adjust = controlOnTarget(spec, spec.targets[i], i);
    const trim =
      spec.control?.kind === "trimmer" && TRIM_DEVICES.has(plan.device)
        ? trimOnTarget(spec, plan, view.writes, i, entry.view, view.extra)
        : null;
    const kept = adjust?.kept ? adjust.control : (trim?.kept ?? null);
    // the ADC firmware drives the table plan's timer and pin: the pin map and checks must name the same
    const tp = kept?.table.plan;
    if (tp && (plan.mode !== "pwm" || plan.modeFactor !== tp.modeFactor || plan.pin.port !== tp.pin.port))
      throw new EngineError(
        "invalid-request",
        `target ${i + 1} (${plan.device}): the kept rate pot runs ${tp.timer} in PWM on ${tp.pin.port}; plan this target as pwm on ${tp.timer}.`,
        `targets.${i}`,
      );
    const own = images?.byFolder[folders[i]] ?? [];
    const imageList = own.map((f) => ({
      path: f.path,
      name: f.path.slice(folders[i].length + 1),
      sha256: sha256Hex(f.content),
      size: sizeOf(f.content),
    }));
    files.push(...own);
    const ctx = {
      retrofit,
      revision: spec.revision,
      engineVersion: ENGINE_VERSION,
      device: plan.device,
      deviceName: entry.name,
      folder: folders[i],
      targetNumber: i + 1,
      plan: { ...plan, notes: plan.notes ?? [], jitterS: plan.jitterS ?? 0 },
      request: spec.targets[i],
      writes: trim ? trim.writes : view.writes,
      pin: view.pin,
      x: trim ? trim.extra : view.extra,
      trigger: TRIGGER_VIEWS[plan.device]?.(plan) ?? null,
      triggerDoc: triggerDoc(plan),
      soft: { wide: plan.softwareDivider > 65535 },
      cautions,
      hasCautions: cautions.length > 0,
      limits,
      basis: limitBasis(plan),
      stage: analysis ?? { periodS: NaN, highS: NaN, outputLabel: "the old stage's output" },
      oldDrove: oldOutputNote(spec.retrofit, analysis),
      servicePins: servicePinsOf(plan),
      images: imageList,
      hasImages: imageList.length > 0,
      flashing: view.flashing ?? [],
      limitsEnd: limits.length + 3,
      // the stage's control on this target: kept (ADC firmware), or not kept with the reason
      adc:
        kept && !trim
          ? {
              wiring: kept.wiring,
              lines: kept.lines,
              summary: kept.summary,
              steps: kept.count,
              titles: kept.titles,
            }
          : false,
      adcNote: adjust && !adjust.kept ? adjust.note : "",
      // a kept selector as a header main.c includes (RP2040, STM32G031, MSP430G2553)
      selector: kept?.files.some((f) => f.path === "src/selector_control.h") ?? false,
      // a kept trimmer: the calibration constant in timing.h (common/trim-constant.h.hbs)
      trim: trim
        ? {
            ...trim.range,
            controlText: trim.controlText,
            lines: trim.kept.lines,
            titles: trim.kept.titles,
            file: trim.kept.summary.kind === "trimmer" ? trim.kept.summary.file : "src/timing.h",
            ownFile: trim.kept.files.length > 0,
            fileName: (trim.kept.files[0]?.path ?? "").replace(/^src\//, ""),
            quarter: trim.range.highPerCount === 4,
            // the high-time arithmetic's width: XC8 is held to 32 bits, the products here stay below 2^32
            lsuffix: plan.device === "pic12f1840" ? "UL" : "ULL",
          }
        : false,
    };
    for (const [out, tpl] of Object.entries(entry.files)) {
      if (kept?.files.some((f) => f.path === out)) continue;
      files.push({ path: `${folders[i]}/${out}`, content: render(`${plan.device}/${tpl}`, ctx) });
    }
    for (const f of kept?.files ?? []) files.push({ path: `${folders[i]}/${f.path}`, content: f.content });
    for (const name of ["PINMAP.md", "pinmap.csv", "CHECKLIST.md"]) {
      files.push({ path: `${folders[i]}/${name}`, content: render(`common/${name}.hbs`, ctx) });
    }
    return {
      folder: folders[i],
      deviceName: entry.name,
      plan,
      limits,
      images: imageList,
      flashing: view.flashing ?? [],
      control: kept ? kept.summary : adjust && !adjust.kept ? { kept: false, note: adjust.note } : null,
    };
  });
  files.push({
    path: "plan.json",
    content: stableJson({
      engineVersion: ENGINE_VERSION,
      retrofit,
      revision: spec.revision,
      stage: spec.stage,
      ...(spec.control ? { control: spec.control } : {}),
      analysis,
      targets: targets.map((t, i) => ({
        folder: t.folder,
        request: spec.targets[i],
        plan: t.plan,
        limits: t.limits,
        ...(t.control ? { control: t.control } : {}),
      })),
    }),
  });
  files.sort(byPath);
  const readme = render("common/README.md.hbs", {
    retrofit,
    revision: spec.revision,
    engineVersion: ENGINE_VERSION,
    cautions,
    hasCautions: cautions.length > 0,
    targets,
    toolchains: images?.toolchains ?? [],
    hasImages: images !== null,
    files: files.map((f) => ({ path: f.path, sha256: sha256Hex(f.content) })),
  });
  files.push({ path: "README.md", content: readme });
  return files.sort(byPath);
}

/** Sources only (no images): see buildBundleFiles in lib/firmware/bundle.ts for the full bundle. */
export function buildBundleSources(spec: BundleSpec, images: BundleImages | null = null): BundleFile[] {
  return buildBundleSourcesWith(spec, (request) => planTarget(request), images);
}

"use client";
// Target rows: device, clock source and frequency, mode, timer, required
// tolerance, output polarity. Device choices come from the engine's catalogue.
import { useFieldArray, useFormContext } from "react-hook-form";
import { formatEng, listDevices } from "@/lib/engine";
import { echoText, formText } from "@/lib/validation/form-text";
import { defaultTarget, deviceById } from "@/lib/validation/target";
import type { WorkspaceForm } from "./form-values";
import { TargetStartFields } from "./target-start-fields";

const DEVICES = listDevices();

type RowErrors = Record<string, { message?: string } | undefined>;

export function TargetsFields({ disabled }: { disabled: boolean }) {
  const { control, register, watch, setValue, formState } = useFormContext<WorkspaceForm>();
  const { fields, append, remove } = useFieldArray({ control, name: "targets" });
  const rowsErrors = (formState.errors.targets ?? []) as unknown as RowErrors[];
  const listError = (formState.errors.targets as { message?: string } | undefined)?.message;

  return (
    <fieldset className="space-y-3">
      <legend className="font-semibold">Targets</legend>
      {fields.length === 0 && (
        <p className="text-sm text-ink-soft">
          No target yet. Add the microcontroller that will replace the stage.
        </p>
      )}
      {fields.map((field, i) => {
        const deviceId = watch(`targets.${i}.device`);
        const device = deviceById(deviceId);
        // A source with discrete steps (PIC12F1840 internal oscillator) lists them; the engine refuses others.
        const steps = device?.clocks.find((c) => c.id === watch(`targets.${i}.clockSource`))?.frequenciesHz;
        const err = rowsErrors[i] ?? {};
        const input = (name: string) => ({
          id: `target-${i}-${name}`,
          "aria-invalid": Boolean(err[name]),
          "aria-describedby": err[name] ? `target-${i}-${name}-error` : undefined,
        });
        const msg = (name: string) =>
          err[name]?.message ? (
            <p id={`target-${i}-${name}-error`} className="field-error">
              {err[name]?.message}
            </p>
          ) : null;
        return (
          <div
            key={field.id}
            className="rounded border border-paper-line p-3"
            aria-label={`Target ${i + 1}`}
            role="group"
          >
            <div className="mb-2 flex items-center justify-between">
              <h3 className="text-sm font-semibold">Target {i + 1}</h3>
              {!disabled && (
                <button type="button" className="btn text-xs" onClick={() => remove(i)}>
                  Remove target {i + 1}
                </button>
              )}
            </div>
            <div className="grid grid-cols-[repeat(auto-fill,minmax(15rem,1fr))] gap-3">
              <div>
                <label className="field-label" htmlFor={`target-${i}-device`}>
                  Device
                </label>
                <select
                  className="input"
                  {...input("device")}
                  {...register(`targets.${i}.device`, {
                    onChange: (e) => {
                      const t = defaultTarget(e.target.value);
                      setValue(`targets.${i}.clockSource`, t.clockSource);
                      setValue(`targets.${i}.clockHz`, t.clockHz);
                      setValue(`targets.${i}.timer`, "");
                    },
                  })}
                >
                  {DEVICES.map((d) => (
                    <option key={d.id} value={d.id}>
                      {d.name}
                    </option>
                  ))}
                </select>
                {msg("device")}
              </div>
              <div>
                <label className="field-label" htmlFor={`target-${i}-clockSource`}>
                  Clock source
                </label>
                <select
                  className="input"
                  {...input("clockSource")}
                  {...register(`targets.${i}.clockSource`, {
                    onChange: (e) => {
                      const c = device?.clocks.find((x) => x.id === e.target.value);
                      if (c?.hz) setValue(`targets.${i}.clockHz`, formText(c.hz), { shouldValidate: true });
                    },
                  })}
                >
                  {device?.clocks.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.label}
                    </option>
                  ))}
                </select>
                {msg("clockSource")}
              </div>
              <div>
                <label className="field-label" htmlFor={`target-${i}-clockHz`}>
                  Clock frequency (Hz)
                </label>
                <input
                  className="input num"
                  autoComplete="off"
                  {...input("clockHz")}
                  {...register(`targets.${i}.clockHz`)}
                  list={steps ? `target-${i}-clockHz-steps` : undefined}
                />
                {steps && (
                  <>
                    <datalist id={`target-${i}-clockHz-steps`}>
                      {steps.map((hz) => (
                        <option key={hz} value={formText(hz)} />
                      ))}
                    </datalist>
                    <p className="text-xs text-ink-soft">
                      This source makes only: {steps.map((hz) => formatEng(hz, "Hz", 6)).join(", ")}.
                    </p>
                  </>
                )}
                {!err.clockHz && echoText(watch(`targets.${i}.clockHz`), "Hz") && (
                  <p className="text-xs text-ink-muted" data-testid={`target-${i}-clockHz-echo`}>
                    read as {echoText(watch(`targets.${i}.clockHz`), "Hz")}
                  </p>
                )}
                {msg("clockHz")}
              </div>
              <div>
                <label className="field-label" htmlFor={`target-${i}-mode`}>
                  Mode
                </label>
                <select className="input" {...input("mode")} {...register(`targets.${i}.mode`)}>
                  <option value="">pwm (default)</option>
                  <option value="pwm">pwm: hardware PWM</option>
                  <option value="toggle">toggle: compare toggles the pin</option>
                  <option value="isr">isr: interrupt drives the pin</option>
                </select>
                {msg("mode")}
              </div>
              <div>
                <label className="field-label" htmlFor={`target-${i}-timer`}>
                  Timer
                </label>
                <select className="input" {...input("timer")} {...register(`targets.${i}.timer`)}>
                  <option value="">best fit</option>
                  {device?.timers.map((t) => (
                    <option key={t.name} value={t.name}>
                      {t.name} ({t.bits}-bit)
                    </option>
                  ))}
                </select>
                {msg("timer")}
              </div>
              <div>
                <label className="field-label" htmlFor={`target-${i}-requiredTolerancePct`}>
                  Required period tolerance (%)
                </label>
                <input
                  className="input num"
                  autoComplete="off"
                  {...input("requiredTolerancePct")}
                  {...register(`targets.${i}.requiredTolerancePct`)}
                />
                {msg("requiredTolerancePct")}
              </div>
              <div className="col-span-full flex items-center gap-2">
                <input
                  type="checkbox"
                  className="h-4 w-4 accent-accent"
                  {...input("activeLow")}
                  {...register(`targets.${i}.activeLow`)}
                />
                <label className="text-sm" htmlFor={`target-${i}-activeLow`}>
                  Active-low output (the pin is low during the old stage&apos;s pulse)
                </label>
              </div>
              <TargetStartFields i={i} errors={err} />
            </div>
          </div>
        );
      })}
      {listError && <p className="field-error">{listError}</p>}
      {!disabled && (
        <button type="button" className="btn" onClick={() => append(defaultTarget())}>
          Add target
        </button>
      )}
    </fieldset>
  );
}

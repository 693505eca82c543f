// The pins a board needs besides the timing output (supply, ground, reset,
// clock, programming header) for the plan's package, from the device's
// `packages` (lib/engine/devices/<id>.ts, each with its datasheet pin table),
// with a plain note whether this plan's clock uses the clock pins.
import { listDevices } from "@/lib/engine";
import type { ServicePin } from "@/lib/engine/plan-types";
import type { BundlePlan } from "./types";

export interface ServicePinRow {
  signal: string;
  role: string;
  port: string;
  packagePins: string;
  package: string;
  notes: string;
  fromMemory: boolean;
}

function useNote(pin: ServicePin, clockKind: string | undefined): string {
  if (pin.role === "crystal")
    return clockKind === "crystal" ? "used: crystal fitted" : "not used by this clock: free or as a port pin";
  if (pin.role === "clock-in")
    return clockKind === "external" ? "used: external clock in" : "not used by this clock";
  return "";
}

export function servicePinsOf(plan: BundlePlan): ServicePinRow[] {
  const device = listDevices().find((d) => d.id === plan.device);
  const packages = device?.packages ?? [];
  const pkg = packages.find((p) => p.name === plan.pin.package) ?? packages[0];
  if (!pkg) return [];
  const kind = device?.clocks.find((c) => c.id === plan.clockSource)?.kind;
  return pkg.servicePins.map((s) => {
    const use = useNote(s, kind);
    return {
      signal: s.signal,
      role: s.role,
      port: s.port ?? "",
      packagePins: s.packagePins.join(", "),
      package: pkg.name,
      notes: use ? `${s.notes}; ${use}` : s.notes,
      fromMemory: s.fromMemory === true,
    };
  });
}

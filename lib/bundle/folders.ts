// One folder per target, named after the device; a second target on the same
// device gets "-2", a third "-3", in target order, so names never depend on
// anything but the spec.
export function targetFolders(devices: string[]): string[] {
  const seen = new Map<string, number>();
  return devices.map((device) => {
    const n = (seen.get(device) ?? 0) + 1;
    seen.set(device, n);
    return n === 1 ? device : `${device}-${n}`;
  });
}

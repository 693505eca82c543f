// What the AVR templates need about the clock: the fuse bytes for the planned
// clock option, its label, and how to put the image on the chip with avrdude
// (Debian package avrdude; a USBasp is the common low-cost programmer, any
// programmer avrdude knows works with PROGRAMMER=...).
import { listDevices } from "@/lib/engine";
import { avrFuses, type AvrFuses } from "./avr-fuses";
import type { DeviceView, RegisterWrite } from "./device-view";
import { hex } from "./format";
import { avrPin } from "./pins";
import type { BundlePlan } from "./types";

export interface AvrClockView {
  fuses: AvrFuses;
  clockLabel: string;
  calibratedRc: boolean;
  flashing: string[];
}

export function avrClockView(plan: BundlePlan): AvrClockView {
  const device = listDevices().find((d) => d.id === plan.device);
  const source = plan.clockSource ?? "crystal";
  const option = device?.clocks.find((c) => c.id === source);
  const fuses = avrFuses(plan.device, source, plan.clockHz);
  const p = `avrdude -p ${fuses.avrdudePart} -c usbasp -P usb`;
  const calibratedRc = source === "rc8m-cal";
  const flashing = [
    `Connect the programmer to the 6-pin ISP header (MISO, SCK, RESET, MOSI, VCC, GND; see PINMAP.md) with the board powered from the programmer or the bench supply, never from mains-derived rails without isolation.`,
    `Set the fuses once per chip (\`make fuses\`): ${p} -U lfuse:w:${hex(fuses.low)}:m -U hfuse:w:${hex(fuses.high)}:m -U efuse:w:${hex(fuses.extended)}:m`,
    `Write the image (\`make flash-shipped\`, or \`make flash\` after a rebuild): ${p} -U flash:w:firmware/firmware.hex:i`,
    ...(calibratedRc
      ? [
          `Store this chip's OSCCAL calibration value in EEPROM byte 0 (\`make calibration OSCCAL=0x..\`): ${p} -U eeprom:w:0x..:m; without it the factory calibration stays.`,
        ]
      : []),
    `Read back and compare: ${p} -U flash:v:firmware/firmware.hex:i -U lfuse:v:${hex(fuses.low)}:m`,
    `Another programmer: replace -c usbasp (e.g. -c avrispmkII, -c stk500v1 -P /dev/ttyUSB0 -b 19200).`,
  ];
  return { fuses, clockLabel: option?.label ?? source, calibratedRc, flashing };
}

/** The device view both AVR devices build from a timer's register writes: pin, clock and fuse facts, ISR vector. */
export function avrDeviceView(
  plan: BundlePlan,
  writes: RegisterWrite[],
  isrVector: string | null,
): DeviceView {
  const pin = avrPin(plan);
  const clock = avrClockView(plan);
  return {
    writes,
    pin,
    flashing: clock.flashing,
    extra: {
      fuses: clock.fuses,
      clockLabel: clock.clockLabel,
      calibratedRc: clock.calibratedRc,
      isr: isrVector !== null,
      isrVector,
      portLetter: pin.port.charAt(1),
      portBit: Number(pin.port.slice(2)),
    },
  };
}

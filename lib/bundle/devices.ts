// Device id -> register view, display name, template folder and files.
import { atmega328pView } from "./device-atmega328p";
import { attiny85View } from "./device-attiny85";
import { msp430g2553View } from "./device-msp430g2553";
import { pic12f1840View } from "./device-pic12f1840";
import { rp2040View } from "./device-rp2040";
import { stm32g031View } from "./device-stm32g031";
import type { DeviceView } from "./device-view";
import type { BundlePlan } from "./types";

export interface DeviceEntry {
  name: string;
  view: (plan: BundlePlan) => DeviceView;
  /** output path under the target folder -> template under templates/<device>/ */
  files: Record<string, string>;
}

const AVR_FILES = { "src/main.c": "main.c.hbs", "src/timing.h": "timing.h.hbs", Makefile: "Makefile.hbs" };

export const DEVICES: Record<string, DeviceEntry> = {
  atmega328p: { name: "ATmega328P", view: atmega328pView, files: AVR_FILES },
  attiny85: { name: "ATtiny85", view: attiny85View, files: AVR_FILES },
  stm32g031: {
    name: "STM32G031",
    view: stm32g031View,
    files: {
      ...AVR_FILES,
      "src/startup.c": "startup.c.hbs",
      "src/device.ld": "device.ld.hbs",
      "src/stm32g031_regs.h": "stm32g031_regs.h.hbs",
    },
  },
  rp2040: {
    name: "RP2040",
    view: rp2040View,
    files: {
      ...AVR_FILES,
      "src/startup.c": "startup.c.hbs",
      "src/device.ld": "device.ld.hbs",
      "src/rp2040_regs.h": "rp2040_regs.h.hbs",
      "src/boot2.S": "boot2.S.hbs",
      "src/rp2040_image.py": "rp2040_image.py.hbs",
    },
  },
  pic12f1840: {
    name: "PIC12F1840",
    view: pic12f1840View,
    files: { ...AVR_FILES, "src/main.asm": "main.asm.hbs" },
  },
  msp430g2553: {
    name: "MSP430G2553",
    view: msp430g2553View,
    files: { ...AVR_FILES, "src/startup.S": "startup.S.hbs", "src/device.ld": "device.ld.hbs" },
  },
};

// MSP430G2553 triggered firmware with an active-low output: the pin is low for
// the pulse (the engine's note "Active-low output: the pin is low for the ...
// pulse.", lib/engine/solver/triggered.ts) and high the rest of the time, from
// the moment its driver is switched on. Checked in the generated main.c
// without mspdebug, so the fast mutation set judges it.
// Sources: MSP430x2xx Family User's Guide SLAU144, Digital I/O: PxDIR bit = 1
// makes the pin an output driven at its PxOUT bit (PxOUT 1 = high, 0 = low);
// instruction set: BIS.B sets the source's bits in the destination, BIC.B
// clears them. MSP430G2x53 datasheet SLAS735, peripheral file map: P1OUT at
// 0x0021.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleTargetRequest } from "@/lib/bundle";
import type { PlanRequest } from "@/lib/engine";
import { msp430TriggerRequest } from "./fixtures";

function mainC(activeLow: boolean): string {
  // the engine's PlanRequest.activeLow, passed through the bundle's target request unchanged
  const target: BundleTargetRequest & Pick<PlanRequest, "activeLow"> = {
    ...msp430TriggerRequest("trigger"),
    activeLow,
  };
  const files = buildBundleSources({
    retrofit: { name: "Active-low check" },
    revision: 1,
    stage: { kind: "timer555-monostable", r: 10e3, c: 1e-6 },
    targets: [target],
  });
  return String(files.find((f) => f.path === "msp430g2553/src/main.c")?.content);
}

/** The output's bit: the line that makes it an output names it. */
function outBit(main: string): number {
  const m = /P1DIR \|= BIT(\d); \/\* P1\.\d output/.exec(main);
  expect(m, "P1DIR output line").not.toBeNull();
  return Number(m![1]);
}

/** The handler's P1OUT operation on the output's mask, by the comment beside it. */
function handlerOp(main: string, bit: number, which: "on at TACCR1" | "off at TACCR0"): string {
  const mask = `0x${(1 << bit).toString(16).toUpperCase().padStart(2, "0")}`;
  const m = new RegExp(`"  (bi[sc]\\.b) #${mask}, &0x0021\\\\n" /\\* \\d: pulse ${which}`).exec(main);
  expect(m, `pulse ${which} handler`).not.toBeNull();
  return m![1];
}

/** The P1OUT writes to the output's bit before its P1DIR line, in order. */
function levelBeforeDriver(main: string, bit: number): string[] {
  const before = main.slice(0, main.indexOf(`P1DIR |= BIT${bit};`));
  return [...before.matchAll(new RegExp(`P1OUT (\\|= |&= \\(uint8_t\\)~)BIT${bit};`, "g"))].map((m) =>
    m[1] === "|= " ? "high" : "low",
  );
}

describe("MSP430G2553 trigger output polarity", () => {
  it("active-low: BIC.B puts the pulse on, BIS.B takes it off", () => {
    const main = mainC(true);
    const bit = outBit(main);
    expect(handlerOp(main, bit, "on at TACCR1")).toBe("bic.b");
    expect(handlerOp(main, bit, "off at TACCR0")).toBe("bis.b");
  });

  it("active-low: P1OUT is set high before P1DIR turns the driver on, never low", () => {
    const main = mainC(true);
    const bit = outBit(main);
    expect(levelBeforeDriver(main, bit)).toEqual(["high"]);
    expect(main).not.toContain(`P1OUT &= (uint8_t)~BIT${bit};`);
  });

  it("active-high: BIS.B on, BIC.B off, and P1OUT low before the driver", () => {
    const main = mainC(false);
    const bit = outBit(main);
    expect(handlerOp(main, bit, "on at TACCR1")).toBe("bis.b");
    expect(handlerOp(main, bit, "off at TACCR0")).toBe("bic.b");
    expect(levelBeforeDriver(main, bit)).toEqual(["low"]);
    expect(main).not.toContain(`P1OUT |= BIT${bit};`);
  });
});

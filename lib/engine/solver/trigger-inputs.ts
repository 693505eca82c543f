// Input pin and worst-case input-to-timer latency of a triggered plan, per
// device (engine.md section 6). The latency is the datasheet's interrupt
// response plus the cycles of the handler up to the write that starts the
// timer. For the AVRs the counts are those of the generated naked handlers
// (templates/<avr>/trigger.c.hbs) plus the compare handler's entry to the
// pin change; for the other devices they are the budget their handlers must
// keep once that firmware lands.
import type { DeviceId, PinAssignment } from "../plan-types";
import { pin } from "../devices/spec";

export type InputEdge = "rising" | "falling" | "both";

export interface TriggerInput {
  input: PinAssignment;
  /** How the pin detects the edge, in the datasheet's words. */
  edgeHow: Record<InputEdge, string>;
  /** Worst case, in clock cycles (the clockHz of the plan). */
  responseCycles: number;
  handlerCycles: number;
  /** Where each count comes from. */
  basis: string;
  /** The timer's own output pin carries the pulse (its pwm pin); otherwise the handlers switch the isr pin. */
  timerDrivesPin?: boolean;
}

export const TRIGGER_INPUTS: Record<DeviceId, TriggerInput> = {
  // ATmega328P datasheet (DS40002061): 13.2 EICRA (ISC01:0 = 01 any change, 10
  // falling, 11 rising); 7.7.1 Interrupt Response Time (4 cycles to the vector,
  // 3 for the vector's jump); pin table 1.1, PDIP-28: PD2 (INT0) = pin 4.
  atmega328p: {
    input: pin({ port: "PD2", function: "INT0", packagePin: 4, package: "PDIP-28", portName: "D", bit: 2 }),
    edgeHow: {
      rising: "EICRA ISC01:0 = 11",
      falling: "EICRA ISC01:0 = 10",
      both: "EICRA ISC01:0 = 01 (any change)",
    },
    responseCycles: 4 + 3 + 2,
    handlerCycles: 17 + 11,
    basis:
      "ATmega328P datasheet, Interrupt Response Time: 4 cycles to the vector + 3 for its jmp, + 2 to finish the busy loop's rjmp; INT0 handler (templates/atmega328p/trigger.c.hbs, naked) up to 17 cycles to the timer start (restart rule: cbi 2, push 2, ldi 1, sts x4 8, ldi 1, sts 2, ldi 1; ignore rule 5); the compare handler's entry to the pin change adds 11 (4 + jmp 3 + rjmp 2 + sbi 2), the same for the off edge, so it shifts the delay, not the pulse (AVR Instruction Set Manual cycle counts)",
  },
  // ATtiny25/45/85 datasheet: 9.2 MCUCR ISC01:0 (same encoding), 4.7.1
  // Interrupt Response Time; pin table: PB2 (INT0) = PDIP-8 pin 7.
  attiny85: {
    input: pin({ port: "PB2", function: "INT0", packagePin: 7, package: "PDIP-8", portName: "B", bit: 2 }),
    edgeHow: {
      rising: "MCUCR ISC01:0 = 11",
      falling: "MCUCR ISC01:0 = 10",
      both: "MCUCR ISC01:0 = 01 (any change)",
    },
    responseCycles: 4 + 2 + 2,
    handlerCycles: 17 + 10,
    basis:
      "ATtiny85 datasheet, Interrupt Response Time: 4 cycles to the vector + 2 for its rjmp, + 2 to finish the busy loop's rjmp; INT0 handler (templates/attiny85/trigger.c.hbs, naked) up to 17 cycles to the timer start (restart rule; ignore rule 5); the compare handler's entry to the pin change adds 10 (4 + rjmp 2 + rjmp 2 + sbi 2), the same for the off edge, so it shifts the delay, not the pulse (AVR Instruction Set Manual cycle counts)",
  },
  // RM0444 (STM32G0x1): EXTI rising/falling trigger selection registers
  // (EXTI_RTSR1, EXTI_FTSR1; both set = both edges), EXTICR port selection.
  // Cortex-M0+ Technical Reference Manual: 15-cycle exception entry with
  // zero-wait-state memory. Pin: TSSOP-20 PA1 (from memory).
  // Handler: templates/stm32g031/trigger.c.hbs (naked Thumb, run from SRAM).
  stm32g031: {
    input: pin({
      port: "PA1",
      function: "EXTI1",
      packagePin: 8,
      package: "TSSOP-20",
      portName: "A",
      bit: 1,
      fromMemory: true,
    }),
    edgeHow: {
      rising: "EXTI_RTSR1 bit 1",
      falling: "EXTI_FTSR1 bit 1",
      both: "EXTI_RTSR1 and EXTI_FTSR1 bit 1",
    },
    responseCycles: 3 + 15 + 3,
    handlerCycles: 10,
    timerDrivesPin: true,
    basis:
      "EXTI input synchroniser 3 cycles (from memory) + Cortex-M0+ exception entry 15 cycles (Cortex-M0+ Technical Reference Manual, interrupt latency with zero-wait-state memory: vector table and handler run from SRAM) + up to 3 to finish the busy loop's branch in flash (1 + 2 wait states, RM0444 FLASH_ACR LATENCY); EXTI handler (templates/stm32g031/trigger.c.hbs, naked) 5 cycles to the TIMx_CR1 CEN store (ldr 2, movs 1, str 2; ARMv6-M cycle counts), restart rule 10 (EGR UG first); the timer's one-pulse mode drives the pin itself, so the pulse has no handler in its path",
  },
  // RP2040 datasheet 2.19 GPIO: IO_BANK0 PROC0_INTE EDGE_HIGH / EDGE_LOW per
  // GPIO; Cortex-M0+ 15-cycle entry. Pin: QFN-56 GPIO15 = pin 18 (from memory).
  // Handler: templates/rp2040/trigger.c.hbs (naked Thumb, run from SRAM).
  rp2040: {
    input: pin({
      port: "GPIO15",
      function: "GPIO edge interrupt (IO_IRQ_BANK0)",
      packagePin: 18,
      package: "QFN-56",
      portName: "GPIO",
      bit: 15,
      gpio: 15,
      funcSel: 5,
      fromMemory: true,
    }),
    edgeHow: {
      rising: "PROC0_INTE EDGE_HIGH",
      falling: "PROC0_INTE EDGE_LOW",
      both: "PROC0_INTE EDGE_HIGH and EDGE_LOW",
    },
    responseCycles: 2 + 15 + 1,
    handlerCycles: 10,
    timerDrivesPin: true,
    basis:
      "GPIO input synchroniser 2 cycles (RP2040 datasheet, GPIO; from memory) + Cortex-M0+ exception entry 15 cycles (Cortex-M0+ Technical Reference Manual, interrupt latency with zero-wait-state memory: vector table and handler run from SRAM) + 1 to finish the busy loop's branch; edge handler (templates/rp2040/trigger.c.hbs, naked) 5 cycles to the PWM CSR.EN store (ldr 2, movs 1, str 2; ARMv6-M cycle counts), restart rule 10 to the CTR = 0 store; the PWM slice then drives the pin itself, so the pulse has no handler in its path",
  },
  // PIC12F1840 datasheet (DS40001441): interrupt-on-change chapter (IOCAP/IOCAN
  // per pin select the edge, both = both edges), interrupt latency (3 to 5
  // instruction cycles for an asynchronous interrupt, 3 to 4 for a synchronous
  // one such as TMR2IF; from memory); RA1 = PDIP-8 pin 6. Handler:
  // templates/pic12f1840/trigger.asm.hbs (assembler, fixed cycle counts).
  pic12f1840: {
    input: pin({
      port: "RA1",
      function: "IOC (IOCAP1/IOCAN1)",
      packagePin: 6,
      package: "PDIP-8",
      portName: "A",
      bit: 1,
    }),
    edgeHow: { rising: "IOCAP1 = 1", falling: "IOCAN1 = 1", both: "IOCAP1 = 1 and IOCAN1 = 1" },
    responseCycles: 5 * 4,
    handlerCycles: (7 + 4 + 10) * 4,
    basis:
      "PIC12F1840 datasheet, interrupt latency up to 5 instruction cycles for an asynchronous interrupt such as interrupt-on-change (from memory); IOC handler (templates/pic12f1840/trigger.asm.hbs) up to 7 instruction cycles to the start of the count (ignore rule 6: banksel 1, btfss skipping 2, banksel 1, btfss 1, bsf TMR2ON 1; restart rule 7: banksel 1, btfss 2, banksel 1, bcf TMR2ON 1, clrf TMR2 1, bsf TMR2ON 1); the Timer2 match handler's entry to the LATA write adds up to 4 (synchronous interrupt latency, from memory) + 10, the same for the pulse's off edge, so it shifts the delay, not the pulse; 4 clocks per instruction cycle; an edge arriving while the match handler runs waits for it (up to 17 instruction cycles more)",
  },
  // MSP430x2xx family user's guide: Digital I/O P1IES/P1IE (one edge per
  // setting: both edges by flipping P1IES in the handler), interrupt
  // acceptance 6 cycles after the current instruction; G2553 datasheet PDIP-20: P1.3 = pin 5.
  // Handlers: templates/msp430g2553/trigger.c.hbs (assembler, fixed cycle counts).
  msp430g2553: {
    input: pin({
      port: "P1.3",
      function: "P1.3 port interrupt (P1IE/P1IES)",
      packagePin: 5,
      package: "PDIP-20",
      portName: "1",
      bit: 3,
    }),
    edgeHow: {
      rising: "P1IES bit 3 = 0",
      falling: "P1IES bit 3 = 1",
      both: "P1IES bit 3 flipped in the handler after each edge",
    },
    responseCycles: 6 + 6,
    handlerCycles: 5 + (6 + 6 + 4),
    basis:
      "MSP430x2xx family user's guide, interrupt acceptance 6 cycles + up to 6 to finish the current instruction; port 1 handler (templates/msp430g2553/trigger.c.hbs, assembler) 5 cycles to the TA0CTL store that starts the count (ignore rule bis.w #MC_1,&TA0CTL; restart rule mov.w #...|MC_1|TACLR,&TA0CTL; family guide instruction cycle table: #N to &EDE 5 cycles); the TACCR1 handler's entry to the P1OUT write adds up to 6 + 6 + 4 (bis.b with a constant-generator mask), the same for the TACCR0 handler's off edge, so it shifts the delay, not the pulse; CPU kept awake (no low-power mode) so no wake-up time adds",
  },
};

/** Plain words on conditioning the input, for the pin map and the checklist. */
export function inputConditioning(start: "trigger" | "zero-cross"): string {
  return start === "zero-cross"
    ? "Mains zero crossings only through an isolated zero-cross detector (optocoupler or transformer-isolated), never a direct connection to the mains; its output to the input pin with the pull-up it needs."
    : "Contacts or open-collector sources: pull-up to the supply and an RC or firmware debounce; logic sources: a series resistor; anything from the mains through an isolated detector.";
}

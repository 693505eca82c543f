// Types of the timer solver: the request, the plan, and the device catalogue.
// Field names of PlanRequest and the first block of TimerPlan are the stable
// contract (engine.md section 4); everything after it is additive.

export type DeviceId = "atmega328p" | "attiny85" | "stm32g031" | "rp2040" | "pic12f1840" | "msp430g2553";

export type TimerMode = "pwm" | "toggle" | "isr";

/** How an output period starts (engine.md section 6): free-running, on a trigger edge, on each mains zero crossing. */
export type PlanStart = "free" | "trigger" | "zero-cross";
export type InputEdge = "rising" | "falling" | "both";
/** A trigger while the delay or pulse runs: ignored, or it starts the delay again. */
export type RetriggerRule = "ignore" | "restart";

export interface PlanRequest {
  device: string;
  clockHz: number;
  periodS: number;
  highS: number;
  /** Preferred mode; default "pwm". Falls back to "isr" (with a note) when the mode cannot reach the period. */
  mode?: TimerMode;
  /** Timer name as the datasheet writes it (TIMER1, TIM2, PWM3, TIMER2, TIMER0_A3); omitted = best timer. */
  timer?: string;
  /** Clock option id from DeviceInfo.clocks; sets clockAccuracyPpm in the plan. Default: the device's first crystal option. */
  clockSource?: string;
  /** Overrides the clock option's accuracy (ppm, symmetric). */
  clockAccuracyPpm?: number;
  /**
   * Output polarity. true: `highS` is the old stage's active pulse and the new
   * output is active low, so the pin is LOW for highS and high for the rest;
   * the plan's targetHighS and highS are then the pin's high time.
   */
  activeLow?: boolean;
  /** Package name from DeviceInfo.packages; omitted = the device's default package (the first listed). */
  package?: string;
  /**
   * Default "free". "trigger" / "zero-cross": the output pulse follows an input
   * edge by `delayS`; `highS` is the pulse width and `periodS` the shortest time
   * between input edges (zero-cross: the half cycle).
   */
  start?: PlanStart;
  /** Input edge to the output pulse's leading edge; default 0. Triggered starts only. */
  delayS?: number;
  /** Input edge that starts the delay; default "falling" for a trigger, "both" for zero-cross (one edge per crossing). */
  edge?: InputEdge;
  /** Triggers only; default "ignore". */
  retrigger?: RetriggerRule;
}

/** Output pin of a plan. ISR plans drive the same pin as a plain GPIO (function "GPIO"). */
export interface PinAssignment {
  /** Vendor port name: "PB1", "PA0", "GPIO0", "RA2", "P1.2". */
  port: string;
  /** Signal name from the datasheet pin table: "OC1A", "TIM2_CH1", "PWM0_A", "CCP1", "TA0.1", or "GPIO". */
  function: string;
  packagePin: number;
  package: string;
  /** Port letter/number and bit, for DDR/TRIS/DIR writes: PB1 -> { portName: "B", bit: 1 }; P1.2 -> { portName: "1", bit: 2 }. */
  portName: string;
  bit: number;
  /** STM32: GPIOx_AFR alternate function number (AF2 -> 2). */
  alternateFunction?: number;
  /** RP2040: GPIO number, FUNCSEL value (4 = PWM), slice and channel. */
  gpio?: number;
  funcSel?: number;
  slice?: number;
  channel?: "A" | "B";
  /** MSP430: P1SEL / P1SEL2 bit values for the timer function. */
  sel?: number;
  sel2?: number;
  /** True when the package pin number was not checked against the datasheet table. */
  fromMemory: boolean;
}

/**
 * A solved timer configuration. Achieved period:
 *   periodS = divider * periodCounts * modeFactor * softwareDivider / clockHz
 *
 * `registers` keys and values, per device / timer / mode (CS = clock-select bits
 * for the divider; n = periodCounts; h = highCounts; every value is the whole
 * register computed from the datasheet bit positions):
 *
 * atmega328p TIMER1 (ATmega328P datasheet, 16-bit Timer/Counter1; CS1 1,8,64,256,1024 -> 1..5)
 *   pwm    (Fast PWM mode 14, TOP = ICR1, non-inverting on OC1A = PB1; high for OCR1A + 1 counts)
 *          TCCR1A = COM1A1|WGM11 = 0x82, TCCR1B = WGM13|WGM12|CS = 0x18|CS, ICR1 = n-1, OCR1A = h-1
 *   toggle (CTC mode 4, TOP = OCR1A, COM1A0 toggles OC1A = PB1)
 *          TCCR1A = COM1A0 = 0x40, TCCR1B = WGM12|CS = 0x08|CS, OCR1A = n-1
 *   isr    (CTC mode 4, TIMER1_COMPA interrupt, PB1 as GPIO)
 *          TCCR1A = 0x00, TCCR1B = 0x08|CS, OCR1A = n-1, TIMSK1 = OCIE1A = 0x02
 * atmega328p TIMER0 (8-bit; CS0 1,8,64,256,1024 -> 1..5) / TIMER2 (8-bit; CS2 1,8,32,64,128,256,1024 -> 1..7)
 *   pwm    (Fast PWM mode 7, TOP = OCRxA, non-inverting on OCxB: OC0B = PD5, OC2B = PD3; high OCRxB + 1 counts)
 *          TCCRxA = COMxB1|WGMx1|WGMx0 = 0x23, TCCRxB = WGMx2|CS = 0x08|CS, OCRxA = n-1, OCRxB = h-1
 *   toggle (CTC mode 2, COMxA0 toggles OCxA: OC0A = PD6, OC2A = PB3)
 *          TCCRxA = COMxA0|WGMx1 = 0x42, TCCRxB = CS, OCRxA = n-1
 *   isr    (CTC mode 2, TIMERx_COMPA interrupt, OCxA pin as GPIO)
 *          TCCRxA = WGMx1 = 0x02, TCCRxB = CS, OCRxA = n-1, TIMSKx = OCIExA = 0x02
 * attiny85 TIMER0 (ATtiny25/45/85 datasheet; CS0 1,8,64,256,1024 -> 1..5): as atmega328p TIMER0
 *   (pwm on OC0B = PB1, toggle and isr on OC0A = PB0), except the interrupt mask is
 *   TIMSK = OCIE0A = 0x10 (key "TIMSK").
 * attiny85 TIMER1 (8-bit; CS13:10 = log2(divider) + 1, divider 1..16384)
 *   pwm    (PWM1A, TOP = OCR1C, COM1A1: OC1A = PB1 set at TCNT1 = 0, cleared on compare)
 *          TCCR1 = PWM1A|COM1A1|CS = 0x60|CS, OCR1C = n-1, OCR1A = h-1
 *   toggle (CTC1 clears on OCR1C, COM1A0 toggles OC1A = PB1 on OCR1A)
 *          TCCR1 = CTC1|COM1A0|CS = 0x90|CS, OCR1C = n-1, OCR1A = n-1
 *   isr    TCCR1 = CTC1|CS = 0x80|CS, OCR1C = n-1, OCR1A = n-1, TIMSK = OCIE1A = 0x40
 * stm32g031 TIM2 (32-bit ARR) / TIM3 (16-bit ARR) (RM0444; channel 1)
 *   pwm    PSC = divider-1, ARR = n-1, CCR1 = h, CCMR1 = OC1M=110 (PWM mode 1)|OC1PE = 0x68,
 *          CCER = CC1E = 0x01, CR1 = ARPE|CEN = 0x81, EGR = UG = 0x01
 *   toggle PSC, ARR, CCR1 = 0, CCMR1 = OC1M=011 (toggle) = 0x30, CCER = 0x01, CR1 = 0x81, EGR = 0x01
 *   isr    PSC, ARR, DIER = UIE = 0x01, CR1 = 0x81, EGR = 0x01 (clear SR.UIF after the UG write)
 *   pin: TIM2_CH1 = PA0 AF2, TIM3_CH1 = PA6 AF1. clockHz is the timer kernel clock
 *   (twice PCLK when the APB prescaler is not 1).
 * rp2040 PWM0..PWM7 (RP2040 datasheet, PWM chapter; the keys are the slice's
 *   CHn_CSR, CHn_DIV, CHn_TOP, CHn_CC with n = pin.slice; output on channel A, GPIO 2n)
 *   pwm    CSR = EN | PH_CORRECT<<1 (0x01 or 0x03), DIV = DIV_INT<<4 | DIV_FRAC, TOP = n-1,
 *          CC = h (channel A, bits 15:0)
 *   isr    CSR = 0x01, DIV (DIV_FRAC = 0), TOP = n-1, INTE = 1<<slice (PWM_IRQ_WRAP)
 *   (no toggle mode: the slice has no compare-toggle output)
 * pic12f1840 TIMER2 (PIC12F1840 datasheet, Timer2 + CCP1; divider = 4 * prescale, T2CKPS 1,4,16,64 -> 0..3)
 *   pwm    T2CON = TMR2ON|T2CKPS = 0x04|CKPS, PR2 = n-1, CCPR1L = DC>>2,
 *          CCP1CON = DC1B<<4 | CCP1M=1100 (PWM, active high) = 0x0C|(DC&3)<<4,
 *          where DC = 4*h is the 10-bit duty value (h in quarter counts)
 *   isr    T2CON, PR2 = n-1, PIE1 = TMR2IE = 0x02, INTCON = GIE|PEIE = 0xC0
 *   (no toggle mode on Timer2)
 * msp430g2553 TIMER0_A3 (MSP430x2xx family user's guide, Timer_A; ID 1,2,4,8 -> 0..3)
 *   pwm    TACTL = TASSEL_2|ID<<6|MC_1 = 0x0210|ID<<6, TACCR0 = n-1, TACCR1 = h, TACCTL1 = OUTMOD_7 = 0x00E0
 *   toggle TACTL, TACCR0 = n-1, TACCR1 = 0, TACCTL1 = OUTMOD_4 = 0x0080
 *   isr    TACTL, TACCR0 = n-1, TACCTL0 = CCIE = 0x0010
 */
export interface TimerPlan {
  // --- contract (engine.md section 4) ---
  device: DeviceId;
  timer: string;
  mode: TimerMode;
  clockHz: number;
  /** Effective clock divider in clock cycles per count (RP2040: DIV_INT + DIV_FRAC/16; PIC: 4 * prescale). */
  divider: number;
  /** Counter steps per hardware period (TOP+1, ARR+1, PR2+1, TACCR0+1). */
  periodCounts: number;
  /** 2 for compare toggle and up-down counting, else 1. */
  modeFactor: 1 | 2;
  /** Interrupts per output period; 1 = hardware only. */
  softwareDivider: number;
  /**
   * pwm: counter steps high (edge-aligned: highS = divider*highCounts/clockHz; up-down:
   * 2*divider*highCounts/clockHz; PIC quarter counts). toggle: equals periodCounts.
   * isr: interrupts the output stays high (highS = highCounts*divider*periodCounts/clockHz).
   */
  highCounts: number;
  periodS: number;
  highS: number;
  periodErrorPpm: number;
  highErrorPpm: number;
  registers: Record<string, number>;
  pin: PinAssignment;

  // --- additions ---
  /** Mode asked for (or "pwm" when omitted); differs from `mode` after a fallback. */
  requestedMode: TimerMode;
  /** Active-low output: the pin is low for the old stage's active pulse (see PlanRequest.activeLow). */
  activeLow: boolean;
  targetPeriodS: number;
  targetHighS: number;
  /** Register-level prescale (AVR/STM32/MSP430: = divider; PIC: Timer2 prescale; RP2040: DIV_INT + DIV_FRAC/16). */
  prescale: number;
  /** RP2040 only: the 8.4 divider fields. */
  divInt?: number;
  divFrac?: number;
  phaseCorrect: boolean;
  /** Clock cycles per output period: divider*periodCounts*modeFactor*softwareDivider (fractional only on RP2040). */
  periodCountsTotal: number;
  /** log2 of the high-time steps per period (duty resolution). */
  resolutionBits: number;
  /** Smallest step of the high time. */
  highResolutionS: number;
  /** Worst single-period deviation from the average: 0 for pure hardware; one sys clock for a fractional RP2040 divider; interrupt latency bound for isr plans. */
  jitterS: number;
  /** isr plans: time between interrupts; null otherwise. */
  interruptIntervalS: number | null;
  interruptIntervalCycles: number | null;
  clockSource: string;
  clockAccuracyPpm: number;
  notes: string[];

  // --- triggered plans only (start "trigger" | "zero-cross"; engine.md section 6) ---
  // The timer is started from the input's interrupt and counts from 0: the
  // pulse is on from delayCounts to delayCounts + highCounts, then the timer
  // stops. periodS and targetPeriodS are the shortest time between input
  // edges (set outside, not by the timer; periodErrorPpm 0), periodCounts the
  // counts of one run (delayCounts + highCounts), softwareDivider 1.
  start?: PlanStart;
  /** Achieved delay from timer start to the pulse: delayCounts*divider/clockHz. */
  delayS?: number;
  targetDelayS?: number;
  delayCounts?: number;
  delayErrorS?: number;
  /** Worst-case input edge to timer start: interrupt response + handler cycles (see latencyBasis). */
  latencyS?: number;
  latencyCycles?: number;
  latencyBasis?: string;
  /** The input pin (external interrupt, pin-change or EXTI line). */
  input?: PinAssignment;
  edge?: InputEdge;
  /** How the edge is selected, in the datasheet's register words. */
  edgeSetting?: string;
  retrigger?: RetriggerRule;
  /** What must sit between the outside signal and the input pin. */
  inputConditioning?: string;
}

export type ClockKind = "crystal" | "internal" | "pll" | "external";

export interface ClockOption {
  id: string;
  label: string;
  /** Fixed frequency, or a range the user picks from (hz omitted). */
  hz?: number;
  minHz?: number;
  maxHz?: number;
  /** Symmetric accuracy in ppm (10 % = 100000 ppm). */
  accuracyPpm: number;
  kind: ClockKind;
  /** Where the accuracy comes from ("datasheet", "common practice", "from memory"). */
  accuracySource: string;
  /** Packages on which this source can run (a crystal needs both oscillator pins); omitted = every package. */
  packages?: string[];
  /** Discrete frequencies the source can make (PIC12F1840 IRCF steps); omitted = any in minHz..maxHz or hz. */
  frequenciesHz?: number[];
}

/** A pin the board needs besides the timer output: supply, ground, reset, crystal, programming header. */
export interface ServicePin {
  /** Datasheet signal name: "VCC", "GND", "RESET", "XTAL1", "SWDIO", "ICSPDAT/RA0", "MCLR" ... */
  signal: string;
  role: "supply" | "ground" | "reset" | "crystal" | "clock-in" | "programming" | "boot";
  /** Port name when the pin is also a port pin ("PC6", "PA13"). */
  port?: string;
  /** Package pin numbers (a supply or ground may have several). */
  packagePins: number[];
  /** Electrical note in plain words: decoupling, pull-up, which header pin. */
  notes: string;
  /** true where the number was not checked against the datasheet's pin table. */
  fromMemory?: boolean;
}

/** One package of a device with the pins every board needs. */
export interface PackageInfo {
  /** "PDIP-28", "TSSOP-20", "QFN-56" ... as written in PinAssignment.package. */
  name: string;
  servicePins: ServicePin[];
}

export interface TimerInfo {
  name: string;
  bits: number;
  /** Legal effective dividers (clock cycles per count); RP2040: 1 to 255 + 15/16 in 1/16 steps (listed as range). */
  dividers: number[] | { min: number; max: number; step: number };
  /** Counter steps per period allowed (TOP+1 etc.). */
  minCounts: number;
  maxCounts: number;
  modes: TimerMode[];
  pins: PinAssignment[];
}

export interface DeviceInfo {
  id: DeviceId;
  name: string;
  family: string;
  core: "avr" | "cortex-m0plus" | "pic" | "msp430";
  /** Document the register and formula facts come from. */
  reference: string;
  minClockHz: number;
  maxClockHz: number;
  clocks: ClockOption[];
  timers: TimerInfo[];
  toolchain: { compiler: string; target: string; header: string };
  /** Packages, the default first, with their supply, ground, reset, crystal and programming pins. */
  packages?: PackageInfo[];
}

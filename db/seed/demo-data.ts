// Demo scenario, invented for local use: the Ostberg Valley Water Board and
// three of its sites. Names, assets and component values are ours.
import type { Role } from "@/db/schema";
import type { TargetTrigger } from "@/lib/revisions/types";

export const DEMO_USERS: { email: string; name: string; role: Role; password: string; site?: string }[] = [
  { email: "admin@ostberg.test", name: "Ilse Marant", role: "admin", password: "admin-demo-pass" },
  { email: "engineer@ostberg.test", name: "Tomas Reiff", role: "engineer", password: "engineer-demo-pass" },
  { email: "reviewer@ostberg.test", name: "Priya Castell", role: "reviewer", password: "reviewer-demo-pass" },
  {
    email: "technician@ostberg.test",
    name: "Joe Haverly",
    role: "technician",
    password: "technician-demo-pass",
  },
];

type DemoTarget = {
  device: string;
  clockSource: string;
  clockHz: number;
  mode?: "pwm" | "toggle" | "isr";
  timer?: string;
  requiredTolerancePct?: number;
  /** absent: the start follows the stage (zero-cross for a synchronised stage) */
  trigger?: TargetTrigger;
};

export type DemoRetrofit = {
  name: string;
  site: string;
  assetTag: string;
  boardRef: string;
  description: string;
  mainsPowered: boolean;
  drivesThyristor: boolean;
  stage: Record<string, unknown> & { kind: string };
  targets: DemoTarget[];
};

export const DEMO_RETROFITS: DemoRetrofit[] = [
  {
    name: "Backwash valve hold-off",
    site: "Tollbridge Works",
    assetTag: "TB-BWV-1",
    boardRef: "BW-2 valve card, IC4",
    description:
      "555 one-shot started by the filter float switch; holds the backwash valve off for its pulse.",
    mainsPowered: false,
    drivesThyristor: false,
    stage: { kind: "timer555-monostable", supplyV: 12, r: 220e3, c: 10e-6, tolerances: { r: 0.05, c: 0.2 } },
    targets: [
      {
        device: "atmega328p",
        clockSource: "crystal",
        clockHz: 16e6,
        mode: "isr",
        trigger: { start: "trigger", delayS: 0, minIntervalS: 10, edge: "falling", retrigger: "ignore" },
      },
    ],
  },
  {
    name: "Sump heater firing stage",
    site: "Kessler Lane Pump House",
    assetTag: "KL-HTR-03",
    boardRef: "FC-112 firing card, Q4",
    description:
      "UJT phase control on the 230 V / 50 Hz mains: rectified and clamped by a 20 V zener, it fires the heater SCR gate through a pulse transformer once per half cycle.",
    mainsPowered: true,
    drivesThyristor: true,
    stage: {
      kind: "ujt",
      supplyV: 20,
      timingR: 47e3,
      timingC: 100e-9,
      eta: 0.65,
      sync: { mainsHz: 50, mainsVrms: 230 },
      tolerances: { timingR: 0.05, timingC: 0.1, eta: [0.08, 0.08] },
    },
    targets: [
      { device: "atmega328p", clockSource: "crystal", clockHz: 16e6, mode: "isr", requiredTolerancePct: 2 },
    ],
  },
  {
    name: "Intake beacon flasher",
    site: "Marrow Hill Reservoir",
    assetTag: "MH-BCN-01",
    boardRef: "BL-7 lamp driver, U1",
    description: "555 astable flashing the intake warning beacon.",
    mainsPowered: false,
    drivesThyristor: false,
    stage: {
      kind: "timer555-astable",
      supplyV: 12,
      ra: 10e3,
      rb: 68e3,
      c: 10e-6,
      tolerances: { ra: 0.05, rb: 0.05, c: [0.2, 0.8] },
    },
    targets: [
      { device: "attiny85", clockSource: "rc8m-cal", clockHz: 8e6, mode: "isr", requiredTolerancePct: 10 },
      { device: "stm32g031", clockSource: "hsi16", clockHz: 16e6, mode: "pwm", requiredTolerancePct: 5 },
    ],
  },
  {
    name: "Dosing pump pulse clock",
    site: "Tollbridge Works",
    assetTag: "TB-DOS-2",
    boardRef: "DP-40 controller, U3A",
    description: "Schmitt-inverter RC clock setting the chlorine dosing pump stroke rate.",
    mainsPowered: false,
    drivesThyristor: false,
    stage: { kind: "schmitt-rc", supplyV: 5, r: 100e3, c: 47e-9, vtPlus: 2.9, vtMinus: 1.6 },
    targets: [
      { device: "rp2040", clockSource: "xosc-pll", clockHz: 125e6, mode: "pwm", requiredTolerancePct: 1 },
    ],
  },
  {
    name: "Relay panel alarm blinker",
    site: "Marrow Hill Reservoir",
    assetTag: "MH-RLY-11",
    boardRef: "Alarm panel A, neon N2",
    description: "Neon-lamp relaxation blinker on the 90 V panel supply.",
    mainsPowered: true,
    drivesThyristor: false,
    stage: {
      kind: "threshold",
      supplyV: 90,
      timingR: 2.2e6,
      timingC: 100e-9,
      peakV: 70,
      valleyV: 55,
      dischargeR: 10e3,
    },
    targets: [{ device: "pic12f1840", clockSource: "hfintosc", clockHz: 500e3, mode: "isr" }],
  },
  {
    name: "Valve stroke timer",
    site: "Tollbridge Works",
    assetTag: "TB-VLV-5",
    boardRef: "VS-3 actuator card, IC2",
    description: "Op-amp astable timing the valve stroke pulses.",
    mainsPowered: false,
    drivesThyristor: false,
    stage: { kind: "opamp-relaxation", r: 47e3, c: 1e-6, feedbackR1: 10e3, feedbackR2: 8.2e3 },
    targets: [{ device: "msp430g2553", clockSource: "dco-cal", clockHz: 1e6, mode: "pwm" }],
  },
];

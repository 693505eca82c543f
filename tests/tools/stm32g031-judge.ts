// The judge moved beside the product's emulator wrapper; tests import it from here or from there.
export * from "@/lib/firmware/emulate/harness/stm32g031-judge";

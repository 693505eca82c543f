// The mspdebug simulator harness moved beside the product's emulator wrapper; tests import it from here or from there.
export * from "@/lib/firmware/emulate/harness/mspdebug-sim";

// The decoders moved beside the product's emulator wrapper; tests import them from here or from there.
export * from "@/lib/firmware/emulate/harness/pic12f1840-tables";

// Prebuilt images in the bundle (buildBundleSources with images): DEVELOPERS.md
// promises that README and the checklist list each `<folder>/firmware/*` image
// with its size and SHA-256. The checklist is worked inside the target's own
// folder (`sha256sum <file>`, as README says), so line B1 names each image by
// its path inside that folder; README's table gives the path from the bundle
// root. The image bytes are the three bytes "abc", whose SHA-256 is the FIPS
// 180-2 Appendix B.1 test vector.
import { describe, expect, it } from "vitest";
import { buildBundleSources, type BundleImages } from "@/lib/bundle";
import { TARGETS, spec } from "./fixtures";

// FIPS 180-2, Appendix B.1: SHA-256("abc")
const ABC_SHA256 = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";

describe("prebuilt images listed in CHECKLIST.md and README.md", () => {
  it("names each image by its path inside the target folder, with its SHA-256 and size", () => {
    const images: BundleImages = {
      byFolder: {
        atmega328p: [{ path: "atmega328p/firmware/firmware.hex", content: new TextEncoder().encode("abc") }],
      },
      toolchains: ["avr-gcc: avr-gcc (GCC) 7.3.0"],
    };
    const files = buildBundleSources(spec([TARGETS[0]]), images);
    const text = (p: string) => String(files.find((f) => f.path === p)!.content);
    // the image itself is in the bundle
    expect(files.some((f) => f.path === "atmega328p/firmware/firmware.hex")).toBe(true);
    const b1 = text("atmega328p/CHECKLIST.md")
      .split("\n")
      .find((l) => l.startsWith("| B1 |"));
    expect(b1).toContain(`| \`firmware/firmware.hex\`: \`${ABC_SHA256}\` |`);
    // README: path from the bundle root, 3 bytes, the same hash
    expect(text("README.md")).toContain(`| \`atmega328p/firmware/firmware.hex\` | 3 | \`${ABC_SHA256}\` |`);
  });

  it("without images, B1 points to the value README lists", () => {
    const files = buildBundleSources(spec([TARGETS[0]]));
    const list = String(files.find((f) => f.path === "atmega328p/CHECKLIST.md")!.content);
    expect(list).toContain(
      "| B1 | SHA-256 of the image you flash (`sha256sum <file>`) | the value README.md lists for it |",
    );
    expect(list).not.toContain("firmware/");
  });
});

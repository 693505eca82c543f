// A number as the forms show it: engineering prefix without the unit, six
// significant digits, and an ASCII "u" for micro so that what the field shows
// can be typed back exactly as it reads ("4k7", "100n", "2u2").
import { formatEng } from "@/lib/engine";

export function formText(v: number): string {
  return formatEng(v, "", 6).replace("µ", "u");
}

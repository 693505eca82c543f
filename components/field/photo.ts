// A phone photo made small enough to send with the check: drawn onto a canvas
// at most 1600 px on its longer side and encoded as JPEG in the browser, so a
// 4 MB camera picture travels as a few hundred kB. Runs in the browser only.
export type PickedPhoto = { mediaType: "image/jpeg"; base64: string; bytes: number; url: string };

const LONG_SIDE = 1600; // enough to read a label or a wire colour (common practice, no source)

function toBase64(bytes: Uint8Array): string {
  let s = "";
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s);
}

export async function shrinkPhoto(file: File): Promise<PickedPhoto> {
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file);
  } catch {
    throw new Error(`${file.name} could not be read as a picture; take or pick a JPEG or PNG photo.`);
  }
  const scale = Math.min(1, LONG_SIDE / Math.max(bitmap.width, bitmap.height));
  const canvas = document.createElement("canvas");
  canvas.width = Math.max(1, Math.round(bitmap.width * scale));
  canvas.height = Math.max(1, Math.round(bitmap.height * scale));
  canvas.getContext("2d")!.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
  bitmap.close();
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/jpeg", 0.82));
  if (!blob) throw new Error("The photo could not be encoded; try another picture.");
  const bytes = new Uint8Array(await blob.arrayBuffer());
  return {
    mediaType: "image/jpeg",
    base64: toBase64(bytes),
    bytes: bytes.length,
    url: URL.createObjectURL(blob),
  };
}

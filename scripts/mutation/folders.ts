// The folders the mutation figures are given for, with the targets of issue 14.
// lib/engine means the engine outside solver/ and devices/.
export const FOLDERS: { folder: string; target: number }[] = [
  { folder: "lib/engine/solver", target: 85 },
  { folder: "lib/engine/devices", target: 85 },
  { folder: "lib/bundle", target: 85 },
  { folder: "lib/engine", target: 80 },
  { folder: "lib/capture", target: 80 },
];

export const folderOf = (file: string) => FOLDERS.find((f) => file.startsWith(f.folder + "/"));

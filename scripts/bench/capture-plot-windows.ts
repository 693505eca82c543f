// The zoom windows both ways of the capture-plot part answer (seconds into a
// 2 s record): a wide view, middling zooms and a few samples.
export const WINDOWS: [number, number][] = [
  [0.05, 1.95],
  [0.5, 0.7],
  [1.2, 1.21],
  [0.3001, 0.3003],
  [1.7, 1.75],
];

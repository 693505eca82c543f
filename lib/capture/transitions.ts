// Transitions per IEEE Std 181-2011: a transition is counted once the
// waveform has gone from one state to the other, with the 10 % and 90 %
// reference levels as hysteresis (a swing that crosses 50 % but not the far
// level is noise, not a transition). Its instant is the 50 % reference level
// instant; its duration the 10 %-to-90 % interval. Crossing instants are
// interpolated linearly between the two samples around the level.

export interface Transition {
  kind: "rise" | "fall";
  /** 50 % reference level instant. */
  t50: number;
  /** 10-90 % (rise) or 90-10 % (fall) transition duration. */
  duration: number;
}

export interface RefLevels {
  p10: number;
  p50: number;
  p90: number;
}

function cross(t: Float64Array, v: Float64Array, j: number, level: number): number {
  const f = (level - v[j]) / (v[j + 1] - v[j]);
  return t[j] + f * (t[j + 1] - t[j]);
}

const UNKNOWN = 0;
const LOW = 1;
const HIGH = 2;

export function findTransitions(t: Float64Array, v: Float64Array, ref: RefLevels): Transition[] {
  const { p10, p50, p90 } = ref;
  const out: Transition[] = [];
  let state = UNKNOWN;
  let enteredAt = 0; // sample where the current state was entered
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (state !== HIGH && x > p90) {
      if (state === LOW) {
        // Back from the first sample above 90 % to the last one at or
        // below 50 %, then on to the last one at or below 10 %. Both exist:
        // v[enteredAt] < 10 %.
        let j = i - 1;
        while (j > enteredAt && v[j] > p50) j--;
        let k = j;
        while (k > enteredAt && v[k] > p10) k--;
        const t90 = cross(t, v, i - 1, p90);
        out.push({ kind: "rise", t50: cross(t, v, j, p50), duration: t90 - cross(t, v, k, p10) });
      }
      state = HIGH;
      enteredAt = i;
    } else if (state !== LOW && x < p10) {
      if (state === HIGH) {
        let j = i - 1;
        while (j > enteredAt && v[j] < p50) j--;
        let k = j;
        while (k > enteredAt && v[k] < p90) k--;
        const t10 = cross(t, v, i - 1, p10);
        out.push({ kind: "fall", t50: cross(t, v, j, p50), duration: t10 - cross(t, v, k, p90) });
      }
      state = LOW;
      enteredAt = i;
    }
  }
  return out;
}
